import { formatWhen } from "@/lib/format/zoned-time";
import { render as renderLayout, type RenderedEmail } from "./templates";

/**
 * E-mails about accounts: confirm an address, reset a password, join a basin.
 * Each carries one link; the link is the only secret, so nothing else in the
 * message needs to be hidden. User-written text (names) is escaped in the HTML.
 */

interface Message {
  subject: string;
  greeting: string;
  paragraphs: string[];
  action: { label: string; url: string };
  expiresAt: Date;
  footnote: string;
}

/** The shared layout, without the planning caution, with how long the link works. */
const render = (m: Message): RenderedEmail =>
  renderLayout(m.subject, {
    greeting: m.greeting,
    paragraphs: m.paragraphs,
    action: m.action,
    caution: false,
    footnote: `The link works once, until ${formatWhen(m.expiresAt, "UTC")}. ${m.footnote}`,
  });

export function verifyAddressEmail(p: { name: string; url: string; expiresAt: Date }): RenderedEmail {
  return render({
    subject: "Confirm your e-mail address for Sagline",
    greeting: `Hello ${p.name},`,
    paragraphs: ["Thank you for creating a Sagline account. Confirm this e-mail address, then sign in."],
    action: { label: "Confirm my e-mail address", url: p.url },
    expiresAt: p.expiresAt,
    footnote: "If you did not create an account, ignore this message; nothing happens without the confirmation.",
  });
}

export function passwordResetEmail(p: { name: string; url: string; expiresAt: Date }): RenderedEmail {
  return render({
    subject: "Choose a new Sagline password",
    greeting: `Hello ${p.name},`,
    paragraphs: ["Someone, probably you, asked to choose a new password for the Sagline account of this address."],
    action: { label: "Choose a new password", url: p.url },
    expiresAt: p.expiresAt,
    footnote: "If it was not you, ignore this message: your password stays as it is.",
  });
}

const ROLE_TEXT = {
  lead: "as a lead (you manage members, open reviews and publish plans)",
  planner: "as a planner (you import networks, run scenarios and propose plans)",
  discharger: "as a discharger",
  stakeholder: "as a stakeholder (you read plans under review and comment on them)",
} as const;

export function invitationEmail(p: {
  inviterName: string;
  basinName: string;
  role: keyof typeof ROLE_TEXT;
  facilityName: string | null;
  url: string;
  expiresAt: Date;
}): RenderedEmail {
  const role =
    p.role === "discharger" && p.facilityName
      ? `as the discharger contact for ${p.facilityName} (you see its proposed allocation and comment on it)`
      : ROLE_TEXT[p.role];
  return render({
    subject: `${p.inviterName} invites you to ${p.basinName} on Sagline`,
    greeting: "Hello,",
    paragraphs: [
      `${p.inviterName} invites you to take part in the planning of ${p.basinName} on Sagline, ${role}.`,
      "Open the link to accept. If you have no Sagline account yet, you can create one there with this e-mail address.",
    ],
    action: { label: "Accept the invitation", url: p.url },
    expiresAt: p.expiresAt,
    footnote: "If you do not know the sender, ignore this message.",
  });
}
