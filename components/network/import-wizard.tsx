"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { Notice } from "@/components/ui/notice";
import { DISCHARGER_FIELDS, guessBindings, REACH_FIELDS } from "@/geo/mapping-fields";
import { useCommitMutation, useUploadMutation, type DraftResultDto } from "@/lib/queries/networks";
import { checkDraft, commitOf, importFormDefaults, importFormSchema, type ImportForm, type ImportFormValues } from "@/lib/validation/import-form";
import { useValidation } from "./use-validation";
import { WizardCheck } from "./wizard-check";
import { WizardFields } from "./wizard-fields";
import { WizardFiles, type OnUpload, type Uploads } from "./wizard-files";
import { WizardSave } from "./wizard-save";

/** An option left empty reads as NaN: say so in words rather than as a type. */
const resolver = zodResolver(importFormSchema, {
  error: (issue) => (issue.code === "invalid_type" && issue.expected === "number" ? "Give a number" : undefined),
});

/**
 * Upload → map fields → validate → accept and save. Nothing is stored as a network until the
 * planner accepts a report without errors. The form (lib/validation/import-form.ts) holds what
 * the planner chooses; each step reads and writes it through the form context, and the draft
 * it makes is checked by the validate route's own schema before it is sent.
 */
export function ImportWizard({ basinId }: { basinId: string }) {
  const router = useRouter();
  const form = useForm<ImportFormValues, unknown, ImportForm>({ resolver, defaultValues: importFormDefaults() });
  const upload = useUploadMutation(basinId);
  const validate = useValidation(basinId);
  const commit = useCommitMutation(basinId);
  const [uploads, setUploads] = useState<Uploads>({});
  const [result, setResult] = useState<DraftResultDto | null>(null);
  const [checked, setChecked] = useState(0);
  const [failure, setFailure] = useState<string | null>(null);
  const fail = (e: unknown) => setFailure(e instanceof Error ? e.message : String(e));

  const onUpload: OnUpload = async (layer, file, choice) => {
    setFailure(null);
    setResult(null);
    const dto = await upload.mutateAsync({ file, layer, ...choice });
    setUploads((u) => ({ ...u, [layer]: dto }));
    form.setValue(layer === "reaches" ? "reachImportId" : "dischargerImportId", dto.id);
    form.setValue(`bindings.${layer}`, guessBindings(layer === "reaches" ? REACH_FIELDS : DISCHARGER_FIELDS, dto.fields));
    return dto;
  };

  const check = form.handleSubmit(async (values) => {
    setFailure(null);
    const { draft, problem } = checkDraft(values);
    if (!draft) return setFailure(problem);
    form.setValue("accepted", false);
    setChecked((n) => n + 1);
    try {
      setResult(await validate.run(draft));
    } catch (e) {
      setResult(null);
      fail(e);
    }
  });

  const save = form.handleSubmit(async (values) => {
    setFailure(null);
    const { draft, problem } = checkDraft(values);
    if (!draft) return setFailure(problem);
    try {
      const saved = await commit.mutateAsync(commitOf(draft, values));
      router.push(`/basins/${basinId}/network?saved=${saved.version}`);
      router.refresh();
    } catch (e) {
      fail(e);
    }
  });

  return (
    <FormProvider {...form}>
      <div className="space-y-6">
        {failure && (
          <Notice tone="error" title="That did not work">
            {failure}
          </Notice>
        )}
        <WizardFiles uploads={uploads} onUpload={onUpload} />
        {uploads.reaches && <WizardFields basinId={basinId} uploads={uploads} onFailure={fail} />}
        {uploads.reaches && <WizardCheck result={result} checked={checked} pending={validate.pending} progress={validate.progress} onCheck={() => void check()} />}
        {result && <WizardSave result={result} saving={commit.isPending} onSave={() => void save()} />}
      </div>
    </FormProvider>
  );
}
