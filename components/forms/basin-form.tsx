"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { TimeZoneInput } from "@/components/forms/time-zone-field";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { UNIT_SYSTEMS, unitSystemLabel } from "@/lib/domain";
import { basinCreateSchema, type BasinCreateInput } from "@/lib/validation/basin";

const FIELDS = ["name", "slug", "description", "doCriterionMgL", "unitSystem", "minReviewDays", "timeZone"] as const;

/** Create or edit a basin's settings; validated by the same schema as the API. */
export function BasinForm({
  initial,
  submitLabel,
  onSubmit,
}: {
  initial?: Partial<BasinCreateInput>;
  submitLabel: string;
  onSubmit: (values: BasinCreateInput) => Promise<unknown>;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const defaults: z.input<typeof basinCreateSchema> = {
    name: "",
    slug: "",
    description: "",
    doCriterionMgL: 5,
    unitSystem: "SI",
    minReviewDays: 30,
    ...initial,
    timeZone: initial?.timeZone ?? "",
  };
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getValues,
    formState: { errors, isSubmitting, dirtyFields },
  } = useForm<z.input<typeof basinCreateSchema>, unknown, BasinCreateInput>({
    resolver: zodResolver(basinCreateSchema),
    defaultValues: defaults,
  });
  // register() leaves an input empty until the page hydrates; its starting value in the
  // server's HTML means a slow phone (or a quick reader) sees the settings as they are.
  const field = <K extends Exclude<(typeof FIELDS)[number], "unitSystem">>(name: K, options?: Parameters<typeof register<K>>[1]) => ({
    ...register(name, options),
    defaultValue: String(defaults[name] ?? ""),
  });

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    setSaved(false);
    try {
      await onSubmit(values);
      setSaved(true);
    } catch (error) {
      const message = applyApiError(error, setError as never, FIELDS);
      if (message) setFailure(message);
    }
  });

  // Suggest a short name from the name until the planner types one.
  const nameField = field("name", {
    onChange: () => {
      if (!initial?.slug && !dirtyFields.slug) {
        const slug = String(getValues("name"))
          .toLowerCase()
          .normalize("NFKD")
          .replace(/[^a-z0-9]+/g, "-")
          .replace(/^-+|-+$/g, "")
          .slice(0, 60);
        setValue("slug", slug);
      }
    },
  });

  return (
    <form onSubmit={submit} noValidate className="max-w-xl space-y-4">
      {failure && <Notice tone="error">{failure}</Notice>}
      {saved && <Notice tone="success">Saved.</Notice>}
      <Field label="Basin name" error={errors.name?.message} {...nameField} />
      <Field
        label="Short name (used in links)"
        error={errors.slug?.message}
        hint="Lower-case letters, digits and hyphens."
        {...field("slug")}
      />
      <div>
        <label htmlFor="description" className="field-label">
          Description
        </label>
        <textarea id="description" rows={3} className="field-input" {...field("description")} />
        {errors.description && <p className="field-error">{errors.description.message}</p>}
      </div>
      <Field
        label="DO criterion (mg/L)"
        type="number"
        step="0.1"
        inputMode="decimal"
        error={errors.doCriterionMgL?.message}
        hint="The dissolved-oxygen level every reach must stay above at critical conditions."
        {...field("doCriterionMgL")}
      />
      <Field
        label="Shortest review (days)"
        type="number"
        step="1"
        inputMode="numeric"
        error={errors.minReviewDays?.message}
        hint="A plan's review period must run at least this long (0: no minimum). 30 days is common practice; your jurisdiction's rules decide."
        {...field("minReviewDays")}
      />
      <div>
        <label htmlFor="basin-time-zone" className="field-label">
          Time zone
        </label>
        <TimeZoneInput id="basin-time-zone" aria-describedby="basin-time-zone-hint" {...field("timeZone")} />
        <p id="basin-time-zone-hint" className="text-xs text-ink-faint">
          Every date and time of this basin — review periods, comments, e-mails, reports — is shown in this zone, named. Type to search (e.g. “Chicago”). Left
          empty, the first review&apos;s zone is taken.
        </p>
        {errors.timeZone && <p className="field-error">{errors.timeZone.message}</p>}
      </div>
      <fieldset>
        <legend className="field-label">Units on screens and exports</legend>
        <div className="flex gap-6 text-sm">
          {UNIT_SYSTEMS.map((u) => (
            <label key={u} className="flex items-center gap-2">
              <input type="radio" value={u} defaultChecked={defaults.unitSystem === u} {...register("unitSystem")} /> {unitSystemLabel(u)}
            </label>
          ))}
        </div>
        {errors.unitSystem && <p className="field-error">{errors.unitSystem.message}</p>}
      </fieldset>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : submitLabel}
      </Button>
    </form>
  );
}
