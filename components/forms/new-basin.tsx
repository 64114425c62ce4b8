"use client";
import { useRouter } from "next/navigation";
import { useCreateBasinMutation } from "@/lib/queries/basins";
import { BasinForm } from "./basin-form";

export function NewBasin() {
  const router = useRouter();
  const create = useCreateBasinMutation();
  return (
    <BasinForm
      submitLabel="Create basin"
      onSubmit={async (values) => {
        const basin = await create.mutateAsync(values);
        router.push(`/basins/${basin.id}`);
      }}
    />
  );
}
