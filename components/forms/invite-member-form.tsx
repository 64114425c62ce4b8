"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { RoleSelect } from "./role-select";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import type { FacilityDto } from "@/lib/services/dto";
import { useInviteMutation } from "@/lib/queries/invitations";
import { invitationCreateSchema, type InvitationCreateInput } from "@/lib/validation/account";

/** A lead invites an address by e-mail; a discharger invitation names one of the basin's facilities. */
export function InviteMemberForm({ basinId, facilities }: { basinId: string; facilities: FacilityDto[] }) {
  const invite = useInviteMutation(basinId);
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting },
  } = useForm<InvitationCreateInput>({
    resolver: zodResolver(invitationCreateSchema),
    defaultValues: { email: "", role: "stakeholder", facilityId: null },
  });
  const role = useWatch({ control, name: "role" });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    setSent(null);
    try {
      const inv = await invite.mutateAsync({ ...values, facilityId: values.role === "discharger" ? values.facilityId : null });
      setSent(inv.email);
      reset();
    } catch (error) {
      const message = applyApiError(error, setError as never, ["email", "role", "facilityId"]);
      if (message) setFailure(message);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Invite by e-mail">
      {failure && <Notice tone="error">{failure}</Notice>}
      {sent && <Notice tone="success">Invitation sent to {sent}. The link works for 14 days.</Notice>}
      <div className="grid gap-3 sm:grid-cols-[1fr_10rem_14rem_auto] sm:items-start">
        <Field label="E-mail to invite" id="invite-email" type="email" error={errors.email?.message} {...register("email")} />
        <RoleSelect id="invite-role" field={register("role")} />
        <div>
          <label htmlFor="invite-facility" className="field-label">
            Facility (dischargers)
          </label>
          <select
            id="invite-facility"
            className="field-input"
            disabled={role !== "discharger"}
            aria-invalid={errors.facilityId ? true : undefined}
            {...register("facilityId", { setValueAs: (v: string | null) => (v ? v : null) })}
          >
            <option value="">{facilities.length ? "Choose…" : "No facilities yet"}</option>
            {facilities.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name} ({f.permitId})
              </option>
            ))}
          </select>
          {errors.facilityId && <p className="field-error">{errors.facilityId.message}</p>}
        </div>
        <Button type="submit" className="sm:mt-6" disabled={isSubmitting}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
