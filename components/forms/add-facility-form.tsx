"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { useCreateFacilityMutation } from "@/lib/queries/members";
import { facilityCreateSchema, type FacilityCreateInput } from "@/lib/validation/member";

export function AddFacilityForm({ basinId }: { basinId: string }) {
  const create = useCreateFacilityMutation(basinId);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<FacilityCreateInput>({ resolver: zodResolver(facilityCreateSchema), defaultValues: { name: "", permitId: "" } });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await create.mutateAsync(values);
      reset();
    } catch (error) {
      const message = applyApiError(error, setError as never, ["name", "permitId"]);
      if (message) setFailure(message);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Add a facility">
      {failure && <Notice tone="error">{failure}</Notice>}
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-start">
        <Field label="Facility name" error={errors.name?.message} {...register("name")} />
        <Field label="Permit id" error={errors.permitId?.message} {...register("permitId")} />
        <Button type="submit" className="sm:mt-6" disabled={isSubmitting}>
          Add facility
        </Button>
      </div>
    </form>
  );
}
