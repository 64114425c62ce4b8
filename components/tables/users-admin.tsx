"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { RoleBadge } from "@/components/ui/role-badge";
import { useCreateUserMutation, useUsersQuery } from "@/lib/queries/members";
import { userCreateSchema, type UserCreateInput } from "@/lib/validation/user";

export function UsersAdmin() {
  const users = useUsersQuery();
  const create = useCreateUserMutation();
  const [failure, setFailure] = useState<string | null>(null);
  const [created, setCreated] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<UserCreateInput>({
    resolver: zodResolver(userCreateSchema),
    defaultValues: { name: "", email: "", password: "", isAdmin: false },
  });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    setCreated(null);
    try {
      const u = await create.mutateAsync(values);
      setCreated(`Created ${u.name} (${u.email}).`);
      reset();
    } catch (error) {
      const message = applyApiError(error, setError as never, ["name", "email", "password", "isAdmin"]);
      if (message) setFailure(message);
    }
  });
  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <section className="card">
        <h2 className="mb-3">All accounts</h2>
        {users.error && <Notice tone="error">{users.error.message}</Notice>}
        {users.data && (
          <div className="overflow-x-auto">
          <table className="data-table" data-testid="users-table">
            <thead>
              <tr>
                <th>Name</th>
                <th>E-mail</th>
                <th>Site role</th>
                <th>Created</th>
              </tr>
            </thead>
            <tbody>
              {users.data.map((u) => (
                <tr key={u.id}>
                  <td className="font-medium">{u.name}</td>
                  <td>{u.email}</td>
                  <td>{u.isAdmin ? <RoleBadge role="admin" /> : <span className="text-ink-faint">member</span>}</td>
                  <td>{new Date(u.createdAt).toLocaleDateString("en-CA")}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
      </section>
      <section className="card">
        <h2 className="mb-3">New account</h2>
        <form onSubmit={submit} noValidate className="space-y-3">
          {failure && <Notice tone="error">{failure}</Notice>}
          {created && <Notice tone="success">{created}</Notice>}
          <Field label="Name" error={errors.name?.message} {...register("name")} />
          <Field label="E-mail" type="email" error={errors.email?.message} {...register("email")} />
          <Field
            label="Initial password"
            type="password"
            autoComplete="new-password"
            error={errors.password?.message}
            hint="At least 10 characters; give it to the person privately."
            {...register("password")}
          />
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register("isAdmin")} /> Site administrator
          </label>
          <Button type="submit" disabled={isSubmitting}>
            Create account
          </Button>
        </form>
      </section>
    </div>
  );
}
