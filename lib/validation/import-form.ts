import { z } from "zod";
import { DISCHARGER_FIELDS, REACH_FIELDS, toMapping, type Bindings } from "@/geo/mapping-fields";
import { importDefaults } from "@/lib/domain";
import { networkCommitSchema, networkDraftSchema, networkOptionsSchema, type NetworkCommit, type NetworkDraft } from "./network";

/**
 * The import wizard's form (components/network/import-wizard.tsx). Its fields are the
 * planner's words for a network draft — upload ids, field bindings, the topology options,
 * the outlet chosen, discharger reassignments, the note and the acceptance — and
 * `draftOf`/`commitOf` turn them into the very bodies the validate and commit routes parse
 * with `networkDraftSchema` and `networkCommitSchema` (lib/validation/network.ts), which
 * `checkDraft` runs in the browser before anything is sent.
 */
const option = networkOptionsSchema.shape;
const bindingSchema = z.object({ source: z.string(), unit: z.string().optional(), kind: z.enum(["BOD5", "CBODu"]).optional() });
const bindingsSchema = z.record(z.string(), bindingSchema.optional());

export const importFormSchema = z.object({
  /** Set by the upload step from the server's answer, never typed. */
  reachImportId: z.string(),
  dischargerImportId: z.string(),
  bindings: z.object({ reaches: bindingsSchema, dischargers: bindingsSchema }),
  /** The options as typed: the API's own rules (and messages), without its defaults, since the form starts from them. */
  options: z.object({
    toleranceM: option.toleranceM.unwrap(),
    maxSnapDistanceM: option.maxSnapDistanceM.unwrap(),
    maxReachLengthKm: option.maxReachLengthKm.unwrap(),
    allowMultipleOutlets: option.allowMultipleOutlets.unwrap(),
  }),
  /** A reach id whose downstream end is the outlet; "" takes the suggested one. */
  outletReach: z.string(),
  /** Permit id → reach id, for dischargers placed on another reach than the nearest. */
  reassign: z.record(z.string(), z.string().min(1)),
  note: networkCommitSchema.shape.note.unwrap(),
  accepted: z.boolean(),
});
export type ImportForm = z.infer<typeof importFormSchema>;
/** The form's fields as the inputs hold them (before the schema has checked them). */
export type ImportFormValues = z.input<typeof importFormSchema>;

/** The wizard's starting values: nothing uploaded, the API's default options. */
export const importFormDefaults = (): ImportForm => ({
  reachImportId: "",
  dischargerImportId: "",
  bindings: { reaches: {}, dischargers: {} },
  options: importDefaults(),
  outletReach: "",
  reassign: {},
  note: "",
  accepted: false,
});

const mappingOf = (fields: typeof REACH_FIELDS | typeof DISCHARGER_FIELDS, b: Bindings) => toMapping(fields, b);

/** The form as the draft the validate route parses (not yet checked: see `checkDraft`). */
export function draftOf(v: ImportForm): z.input<typeof networkDraftSchema> {
  return {
    reachImportId: v.reachImportId,
    reachMapping: mappingOf(REACH_FIELDS, v.bindings.reaches) as NetworkDraft["reachMapping"],
    ...(v.dischargerImportId
      ? { dischargerImportId: v.dischargerImportId, dischargerMapping: mappingOf(DISCHARGER_FIELDS, v.bindings.dischargers) as NetworkDraft["dischargerMapping"] }
      : {}),
    options: {
      ...v.options,
      ...(v.outletReach ? { outlets: [{ reachId: v.outletReach }] } : {}),
      ...(Object.keys(v.reassign).length ? { reassign: v.reassign } : {}),
    },
  };
}

/** A field the draft names, in the wizard's words (for the message when the draft is refused). */
const WHERE: Record<string, string> = {
  reachImportId: "Reach lines",
  reachMapping: "Reach fields",
  dischargerImportId: "Dischargers",
  dischargerMapping: "Discharger fields",
  options: "Options",
};

/**
 * The draft checked by the validate route's own schema: the draft, or one sentence naming
 * where the first problem is (the same message the route would answer with).
 */
export function checkDraft(v: ImportForm): { draft: NetworkDraft; problem?: undefined } | { draft?: undefined; problem: string } {
  const parsed = networkDraftSchema.safeParse(draftOf(v));
  if (parsed.success) return { draft: parsed.data };
  const issue = parsed.error.issues[0];
  const where = WHERE[String(issue.path[0])] ?? "The draft";
  const rest = issue.path.slice(1).join(".");
  return { problem: `${where}${rest ? ` (${rest})` : ""}: ${issue.message}` };
}

/** The commit route's body for a checked draft and the form's note (the report was accepted). */
export const commitOf = (draft: NetworkDraft, v: ImportForm): NetworkCommit => ({ draft, note: v.note, acceptReport: true });
