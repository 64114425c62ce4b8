"use client";
import { useFormContext, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { DraftResultDto } from "@/lib/queries/networks";
import type { ImportFormValues } from "@/lib/validation/import-form";

/** Step 4: a report without errors is read, accepted (warnings and all) and saved as the basin's next network version. */
export function WizardSave({ result, saving, onSave }: { result: DraftResultDto; saving: boolean; onSave: () => void }) {
  const { register, control } = useFormContext<ImportFormValues>();
  const accepted = useWatch({ control, name: "accepted" });
  const { errors, warnings } = result.report;
  return (
    <section className="card space-y-3">
      <h2>4. Save as a new network version</h2>
      {errors.length > 0 ? (
        <Notice tone="error">Fix the {errors.length} error(s) above (in the files, the fields or the options), then check again.</Notice>
      ) : (
        <>
          <div>
            <label htmlFor="network-note" className="field-label">
              Note for this version (optional)
            </label>
            <input id="network-note" className="field-input" maxLength={500} {...register("note")} />
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register("accepted")} />
            I have read the report{warnings.length ? ` and accept its ${warnings.length} warning(s)` : ""}
          </label>
          <Button disabled={!accepted || saving} onClick={onSave}>
            {saving ? "Saving…" : "Save network"}
          </Button>
        </>
      )}
    </section>
  );
}
