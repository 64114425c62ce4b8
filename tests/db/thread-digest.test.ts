import { beforeAll, describe, expect, it } from "vitest";
import { addComment, respondToThread } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();

/** The thread notices queued for one basin, oldest first. */
const threadMail = (basinId: string) =>
  db
    .selectFrom("email_outbox")
    .select(["to_address", "dedupe_key", "subject", "text_body", "next_attempt_at"])
    .where("basin_id", "=", basinId)
    .where("kind", "=", "thread_reply")
    .orderBy("id")
    .execute();

describe("thread notices are gathered per recipient and window", () => {
  let w: World;
  let threadId: string;
  beforeAll(async () => {
    w = await buildWorld(db);
    threadId = (await planAt(db, w, "review")).planThreadId;
  });

  it("notifies the first comment at once; 300 comments make a handful of e-mails, not hundreds", async () => {
    const authors = [w.users.discharger, w.users.outsider, w.users.stakeholder, w.users.spare];
    await scoped(addComment)(db, authors[0], w.basinId, threadId, "comment 0 from the discharger");
    expect(await threadMail(w.basinId)).toHaveLength(0); // nobody else has written yet

    const before = Date.now();
    await scoped(addComment)(db, authors[1], w.basinId, threadId, "comment 1, the first reply");
    const first = await threadMail(w.basinId);
    // the discharger hears of the first reply straight away, with its text
    expect(first.map((m) => m.to_address)).toEqual([authors[0].email]);
    expect(first[0].text_body).toContain("comment 1, the first reply");
    expect(first[0].next_attempt_at.getTime()).toBeLessThanOrEqual(before + 5_000);

    for (let i = 2; i < 300; i++) await scoped(addComment)(db, authors[i % authors.length], w.basinId, threadId, `comment ${i} in a busy thread`);

    const mail = await threadMail(w.basinId);
    // one "first" notice and at most one summary per recipient per window; the 300
    // comments may straddle a window boundary, hence at most 2 windows × 2 × 4 people
    expect(mail.length).toBeLessThanOrEqual(16);
    expect(mail.length).toBeGreaterThanOrEqual(4);
    const perRecipient = new Map<string, number>();
    for (const m of mail) perRecipient.set(m.to_address, (perRecipient.get(m.to_address) ?? 0) + 1);
    expect([...perRecipient.keys()].sort()).toEqual(authors.map((a) => a.email).sort());
    for (const n of perRecipient.values()) expect(n).toBeLessThanOrEqual(4);

    // the summaries wait for their window's end and carry the latest comments, never the recipient's own
    const digests = mail.filter((m) => m.dedupe_key.startsWith("thread_digest:"));
    expect(digests.length).toBeGreaterThanOrEqual(4);
    for (const d of digests) expect(d.next_attempt_at.getTime()).toBeGreaterThan(before);
    const latestOthers = digests.filter((d) => d.to_address !== authors[299 % authors.length].email);
    expect(latestOthers.some((d) => d.text_body.includes("comment 299 in a busy thread"))).toBe(true);
    const spareDigest = digests.filter((d) => d.to_address === w.users.spare.email).at(-1)!;
    expect(spareDigest.subject).toMatch(/^\d+ new comments:/);
  });

  it("a planner's response still goes to each participant on its own", async () => {
    await scoped(respondToThread)(db, w.users.planner, w.basinId, threadId, "Noted: the busy thread is answered");
    const answers = (await threadMail(w.basinId)).filter((m) => m.text_body.includes("the busy thread is answered"));
    expect(answers).toHaveLength(4);
  });
});
