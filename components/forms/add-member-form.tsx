"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { RoleSelect } from "./role-select";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { useAddMemberMutation } from "@/lib/queries/members";
import { memberAddSchema, type MemberAddInput } from "@/lib/validation/member";

export function AddMemberForm({ basinId }: { basinId: string }) {
  const add = useAddMemberMutation(basinId);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<MemberAddInput>({ resolver: zodResolver(memberAddSchema), defaultValues: { email: "", role: "stakeholder" } });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await add.mutateAsync(values);
      reset();
    } catch (error) {
      const message = applyApiError(error, setError as never, ["email", "role"]);
      if (message) setFailure(message);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Add a member">
      {failure && <Notice tone="error">{failure}</Notice>}
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <Field label="E-mail of an existing account" type="email" error={errors.email?.message} {...register("email")} />
        <RoleSelect id="member-role" field={register("role")} />
        <Button type="submit" className="sm:mt-6" disabled={isSubmitting}>
          Add member
        </Button>
      </div>
    </form>
  );
}
