import { createInvitation } from "@/lib/services/invitations";
import { register, requestPasswordReset } from "@/lib/services/accounts";
import { invitationCreateSchema } from "@/lib/validation/account";
import type { World } from "../../support/world";
import { all, basin, denied, matrix, signedIn, uniq, type Entry } from "./kit";
import { scoped } from "../../support/scoped";

/** Accounts for the public: registration, confirmation, password reset, invitations, following. */

const PASSWORD = "matrix-password-1";
const newPassword = () => ({ password: PASSWORD, confirmPassword: PASSWORD });

/** The token of the newest link to `path` queued for `address` (read from the outbox, as the e-mail carries it). */
async function tokenFor(address: string, path: string): Promise<string> {
  const row = await matrix.db
    .selectFrom("email_outbox")
    .select("text_body")
    .where("to_address", "=", address)
    .orderBy("id", "desc")
    .executeTakeFirstOrThrow();
  const match = row.text_body.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link for ${address}`);
  return match[1];
}

const withVerifyLink = async () => {
  const email = `matrix-${uniq()}@public.test`;
  await register(matrix.db, { name: "Matrix Person", email, ...newPassword() });
  return { token: await tokenFor(email, "/verify") };
};
const withResetLink = async (w: World) => {
  await requestPasswordReset(matrix.db, w.users.spare.email);
  return { token: await tokenFor(w.users.spare.email, "/reset-password") };
};
/** An invitation of a new address (no account yet) into the world's basin, sent by its lead. */
const withInvitation = async (w: World) => {
  const email = `invited-${uniq()}@public.test`;
  const inv = await scoped(createInvitation)(matrix.db, w.users.lead, w.basinId, invitationCreateSchema.parse({ email, role: "stakeholder" }));
  return { invitationId: inv.id, token: await tokenFor(email, "/invite") };
};
const token = (_w: World, p: Record<string, string>) => ({ token: p.token });

export const routes: Record<string, Entry> = {
  "app/api/account/register/route.ts": {
    load: () => import("@/app/api/account/register/route"),
    // public: anyone may register a new address
    methods: { POST: { expect: all(201), body: () => ({ name: "New Person", email: `reg-${uniq()}@public.test`, ...newPassword() }) } },
  },
  "app/api/account/verify/route.ts": {
    load: () => import("@/app/api/account/verify/route"),
    // whoever holds the e-mailed link confirms the address
    methods: { POST: { expect: all(200), prepare: withVerifyLink, body: (_w, p) => ({ token: p.token }) } },
  },
  "app/api/account/password-reset/route.ts": {
    load: () => import("@/app/api/account/password-reset/route"),
    methods: { POST: { expect: all(202), body: (w) => ({ email: w.users.spare.email }) } },
  },
  "app/api/account/password-reset/confirm/route.ts": {
    load: () => import("@/app/api/account/password-reset/confirm/route"),
    methods: { POST: { expect: all(200), prepare: withResetLink, body: (_w, p) => ({ token: p.token, ...newPassword() }) } },
  },
  "app/api/invitations/[token]/route.ts": {
    load: () => import("@/app/api/invitations/[token]/route"),
    methods: { GET: { expect: all(200), prepare: withInvitation, params: token } },
  },
  "app/api/invitations/[token]/accept/route.ts": {
    load: () => import("@/app/api/invitations/[token]/accept/route"),
    // the invitation is for another address than every caller's: signed in, but refused
    // (acceptance by the invited account is in tests/db/accounts.test.ts)
    methods: { POST: { expect: signedIn(403), prepare: withInvitation, params: token } },
  },
  "app/api/invitations/[token]/register/route.ts": {
    load: () => import("@/app/api/invitations/[token]/register/route"),
    methods: {
      POST: { expect: all(201), prepare: withInvitation, params: token, body: () => ({ name: "Invited Person", ...newPassword() }) },
    },
  },
  "app/api/basins/[basinId]/invitations/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/invitations/route"),
    methods: {
      GET: { expect: denied({ admin: 200, lead: 200 }), params: basin },
      POST: {
        expect: denied({ admin: 201, lead: 201 }),
        params: basin,
        body: (w) => ({ email: `inv-${uniq()}@public.test`, role: "discharger", facilityId: w.facilityId }),
      },
    },
  },
  "app/api/basins/[basinId]/invitations/[invitationId]/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/invitations/[invitationId]/route"),
    methods: {
      DELETE: {
        expect: denied({ admin: 204, lead: 204 }),
        prepare: withInvitation,
        params: (w, p) => ({ basinId: w.basinId, invitationId: p.invitationId }),
      },
    },
  },
  "app/api/basins/[basinId]/follow/route.ts": {
    load: () => import("@/app/api/basins/[basinId]/follow/route"),
    // anyone signed in may follow any basin, member or not
    methods: {
      GET: { expect: signedIn(200), params: basin },
      PUT: { expect: signedIn(200), params: basin },
      DELETE: { expect: signedIn(200), params: basin },
    },
  },
};
