/**
 * The one table of display names: every code a screen, report, e-mail or export shows a
 * person (objectives, reaeration formulas, roles, statuses, audit actions, conditions,
 * field labels) is read through here, so a code never reaches a reader as it is stored.
 */
import { ROLE_GROUP_NAMES, ROLE_NAMES, type BasinRole } from "@/lib/domain";

// The names of the domain vocabulary (objectives, reaeration methods, temperature rules,
// roles, run and plan states, unit systems) are kept beside their codes in lib/domain and
// read through here like every other display name.
export {
  OBJECTIVE_NAMES,
  PLAN_STATUS_NAMES,
  REAERATION_NAMES,
  ROLE_NAMES,
  RUN_KIND_NAMES,
  RUN_STATUS_NAMES,
  THETA_RULE_NAMES,
  THREAD_STATUS_NAMES,
  UNIT_SYSTEM_NAMES,
  unitSystemLabel,
} from "@/lib/domain";

/** Each recorded audit action as a sentence whose subject is the "Who" column. */
export const AUDIT_ACTION_NAMES: Record<string, string> = {
  "basin.created": "created the basin",
  "basin.updated": "changed the basin's settings",
  "member.added": "added a member",
  "member.removed": "removed a member",
  "member.role_changed": "changed a member's role",
  "facility.created": "added a facility",
  "facility.user_linked": "linked a discharger to a facility",
  "facility.user_unlinked": "unlinked a discharger from a facility",
  "invitation.sent": "sent an invitation",
  "invitation.accepted": "accepted an invitation",
  "invitation.revoked": "revoked an invitation",
  "import.uploaded": "uploaded a GIS file",
  "gauge.uploaded": "uploaded a gauge's daily flow record",
  "survey.uploaded": "uploaded a synoptic survey",
  "temperature_record.uploaded": "uploaded a daily water-temperature record",
  "network.committed": "saved a new network version",
  "network.reach_edited": "edited a reach",
  "network.discharger_edited": "edited an outfall",
  "scenario.created": "created a scenario",
  "scenario.updated": "changed a scenario",
  "scenario.deleted": "deleted a scenario",
  "run.queued": "started a run",
  "plan.proposed": "proposed a plan",
  "plan.exported": "downloaded an unpublished plan",
  "plan.published": "published a plan",
  "plan.withdrawn": "withdrew a plan",
  "review.opened": "opened a review period",
  "review.extended": "extended a review period",
  "review.closed": "closed a review period",
  "comment.added": "commented in a thread",
  "thread.addressed": "answered a thread",
  "user.registered": "registered an account",
  "user.email_verified": "confirmed an e-mail address",
  "user.password_reset_requested": "asked to reset a password",
  "user.password_reset": "reset a password",
  "user.created": "created an account",
};

/** "Opened a review period" — what the "What" column of the audit trail reads beside "Who". */
export function auditAction(action: string): string {
  const verb = AUDIT_ACTION_NAMES[action] ?? `recorded an event (${action})`;
  return verb.charAt(0).toUpperCase() + verb.slice(1);
}

/** Names of the keys audit events keep in their details. */
export const AUDIT_DETAIL_NAMES: Record<string, string> = {
  format: "file",
  version: "version",
  status: "state",
  runId: "run",
  revises: "revises plan",
  name: "name",
  role: "role",
  from: "from",
  to: "to",
  startsAt: "starts",
  endsAt: "ends",
  reason: "reason",
  by: "by",
  email: "e-mail",
  kind: "kind",
  fields: "fields",
};

/** What an audit event changed, as a word the "On" column shows. */
export const AUDIT_TARGET_NAMES: Record<string, string> = {
  basin: "basin",
  user: "member",
  facility: "facility",
  invitation: "invitation",
  import: "GIS file",
  gauge: "gauge record",
  network: "network version",
  reach: "reach",
  scenario: "scenario",
  run: "run",
  plan: "plan",
  thread: "thread",
};

/** What a role may do, for the refusal sentence (lib/auth/guard.ts). The keys are the basin actions of lib/auth/permissions.ts. */
export const ACTION_PHRASES: Record<string, string> = {
  "basin.read": "open this basin",
  "basin.update": "change the basin's settings",
  "members.read": "see the basin's members",
  "members.manage": "add, remove or change members",
  "facilities.read": "see the basin's facilities",
  "facilities.manage": "add or change facilities",
  "audit.read": "read the audit trail",
  "network.import": "import or edit the network",
  "scenario.read": "see the network, scenarios and runs",
  "scenario.edit": "create or change scenarios",
  "scenario.run": "run scenarios",
  "plan.propose": "propose plans",
  "review.manage": "open, extend or close review periods",
  "plan.publish": "publish plans",
  "comment.create": "comment on plans in review",
  "comment.answer": "answer comments",
};

/** Site-wide actions (lib/auth/permissions.ts SITE_ACTIONS), for the refusal a non-administrator reads. */
export const SITE_ACTION_PHRASES: Record<string, string> = {
  "users.manage": "manage user accounts",
  "basins.manage": "manage every basin",
};

/** "the basin's planners and lead" for the roles given, in the table's order. */
export function rolesPhrase(roles: readonly BasinRole[]): string {
  // Lead last: "the basin's planners and lead".
  const order: BasinRole[] = ["planner", "discharger", "stakeholder", "lead"];
  const names = order.filter((r) => roles.includes(r)).map((r) => ROLE_GROUP_NAMES[r]);
  if (names.length === 0) return "no member of the basin";
  if (names.length === 4) return "every member of the basin";
  const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
  return `the basin's ${list}`;
}

/**
 * The refusal a member reads: who may do it, and the reader's own role.
 * Example: refusal("scenario.read", ["lead", "planner"], "discharger") →
 * "Only the basin's planners and lead can see the network, scenarios and runs; you are a discharger here."
 */
export function refusal(action: string, allowed: readonly BasinRole[], role: BasinRole | null): string {
  const what = ACTION_PHRASES[action] ?? "do this";
  const mine = role ? `; you are ${role === "lead" ? "the agency lead" : `a ${ROLE_NAMES[role].toLowerCase()}`} here` : "";
  if (allowed.length === 0) return `No member of the basin can ${what}${mine}.`;
  return `Only ${rolesPhrase(allowed)} can ${what}${mine}.`;
}

/** The model file's own condition in results computed outside a scenario ("base"): never shown as that code. */
const UNNAMED_CONDITION = "base";

/** A design condition's name as a reader sees it; the unnamed one reads "the design condition". */
export const conditionName = (name: string): string => (name === UNNAMED_CONDITION ? "the design condition" : name);

/**
 * The scenario fields a person types, by their path in lib/validation/scenario.ts: the label
 * the editor shows, used by the validation messages too so a message names the field as the
 * reader sees it.
 */
export const SCENARIO_FIELD_LABELS = {
  flowScale: "Flow scale",
  designFlow: "Design flow",
  outletFlow: "Design flow at the outlet",
  designTemperature: "Design temperature",
  kd: "Deoxygenation k_d",
  ka: "Reaeration k_a",
  ks: "Settling k_s",
  sod: "Sediment oxygen demand",
  kn: "Nitrification k_n",
  headwaterCbodu: "Headwater CBODu",
  headwaterNbodu: "Headwater NBODu",
  headwaterDo: "Headwater DO",
  effluentBod5: "Effluent BOD5",
  effluentCbodu: "Effluent CBODu",
  effluentDo: "Effluent DO",
  effluentTemperature: "Effluent temperature",
  bottleRate: "Bottle rate k1",
  floorBod5: "Technology floor, effluent BOD5",
  mosDo: "Margin of safety as DO",
  mosFraction: "Margin of safety as a share of capacity",
  reserveFraction: "Reserve capacity as a share",
  criterion: "Criterion for this scenario",
  stepKm: "Profile spacing",
  conditions: "Critical conditions",
  conditionName: "Condition name",
  scenarioName: "Scenario name",
  network: "Network version",
} as const;

/** "Tamsel River basin: DO allocation" — a plan's title with its basin, the basin named once even when the title starts with it. */
export function titleWithBasin(basinName: string, title: string): string {
  return title.toLowerCase().startsWith(basinName.toLowerCase()) ? title : `${basinName}: ${title}`;
}

export const nameOf = (names: Readonly<Record<string, string>>, key: unknown): string => names[String(key)] ?? String(key);
