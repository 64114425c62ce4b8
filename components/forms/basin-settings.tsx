"use client";
import type { BasinDto } from "@/lib/services/dto";
import { useBasinQuery, useUpdateBasinMutation } from "@/lib/queries/basins";
import { BasinForm } from "./basin-form";

export function BasinSettings({ basin }: { basin: BasinDto }) {
  const { data } = useBasinQuery(basin.id, basin);
  const update = useUpdateBasinMutation(basin.id);
  const b = data ?? basin;
  return (
    <BasinForm
      submitLabel="Save settings"
      initial={{
        name: b.name,
        slug: b.slug,
        description: b.description,
        doCriterionMgL: b.doCriterionMgL,
        unitSystem: b.unitSystem,
        minReviewDays: b.minReviewDays,
        timeZone: b.timeZone,
      }}
      onSubmit={(values) => update.mutateAsync(values)}
    />
  );
}
