import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { listOutbox } from "@/db/queries/email";
import { startMailServer, type MailServer } from "@/lib/email/mailbox";
import { queueEmail } from "@/lib/email/outbox";
import { outboxMessageId, retryDelayMs, sendPending } from "@/lib/email/sender";
import { reviewOpenedEmail } from "@/lib/email/templates";
import { createMailer } from "@/lib/email/transport";
import { fileDb } from "../support/file-db";

const db = fileDb();

const notice = (n: number) =>
  reviewOpenedEmail({
    recipientName: `Reader ${n}`,
    basinName: "Alder Creek",
    planTitle: "Summer low-flow plan",
    planVersion: 1,
    startsAt: new Date("2027-01-04T09:00:00Z"),
    endsAt: new Date("2027-02-04T17:00:00Z"),
    timeZone: "UTC",
    url: "http://127.0.0.1:3000/basins/alder/plans/1",
  });

async function queue(n: number, dedupeKey = `review_opened:test:${n}`) {
  return db.transaction().execute((trx) =>
    queueEmail(trx, { to: `reader${n}@example.test`, kind: "review_opened", dedupeKey, ...notice(n) }),
  );
}

const rows = () => listOutbox(db);

// this file is the only one writing the outbox; each test starts from an empty one
beforeEach(async () => {
  await db.deleteFrom("email_outbox").execute();
});

describe("queueEmail", () => {
  it("writes nothing when the event's transaction rolls back", async () => {
    await expect(
      db.transaction().execute(async (trx) => {
        await queueEmail(trx, { to: "reader@example.test", kind: "review_opened", dedupeKey: "rolled-back", ...notice(1) });
        expect(await trx.selectFrom("email_outbox").select("id").where("dedupe_key", "=", "rolled-back").execute()).toHaveLength(1);
        throw new Error("the event failed");
      }),
    ).rejects.toThrow("the event failed");
    expect(await rows()).toHaveLength(0);
  });

  it("keeps the message when the transaction commits, pending and due", async () => {
    expect(await queue(1)).toBe(true);
    const [row] = await rows();
    expect(row).toMatchObject({ to_address: "reader1@example.test", status: "pending", attempts: 0, kind: "review_opened" });
    expect(row.subject).toContain("Summer low-flow plan");
    expect(row.html_body).toContain("<html>");
  });

  it("queues one row for the same dedupe key given twice", async () => {
    expect(await queue(1, "same-event")).toBe(true);
    expect(await queue(2, "same-event")).toBe(false);
    const all = await rows();
    expect(all).toHaveLength(1);
    expect(all[0].to_address).toBe("reader1@example.test");
  });

  it("refuses a recipient that is not an e-mail address", async () => {
    await expect(queue(0).then(() => db.transaction().execute((trx) =>
      queueEmail(trx, { to: "not an address", kind: "account", dedupeKey: "bad", ...notice(0) }),
    ))).rejects.toThrow(/"to"/);
  });
});

describe("sendPending with the SMTP server down, then up", () => {
  let server: MailServer | null = null;
  afterAll(async () => {
    await server?.close();
  });

  it("loses nothing while the server is down and delivers every message exactly once when it is back", async () => {
    // find a free loopback port, then stop the server: nothing listens there now
    server = await startMailServer({ port: 0 });
    const port = server.port;
    await server.close();
    server = null;
    const mailer = createMailer(`smtp://127.0.0.1:${port}`);

    for (let n = 1; n <= 5; n++) await queue(n);
    const t0 = new Date();
    const down = await sendPending(db, { now: t0, mailer, batchSize: 2, baseDelayMs: 60_000 });
    expect(down).toEqual({ sent: 0, retried: 5, failed: 0 });
    let all = await rows();
    expect(all).toHaveLength(5);
    for (const row of all) {
      expect(row.status).toBe("pending");
      expect(row.attempts).toBe(1);
      expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);
      expect(row.next_attempt_at.getTime()).toBe(t0.getTime() + 60_000);
      expect(row.sent_at).toBeNull();
    }

    // the back-off holds: a run before it has passed takes nothing, even with the server up
    server = await startMailServer({ port });
    expect(await sendPending(db, { now: new Date(t0.getTime() + 59_000), mailer })).toEqual({ sent: 0, retried: 0, failed: 0 });
    expect(server.received).toHaveLength(0);

    const t1 = new Date(t0.getTime() + 61_000);
    const up = await sendPending(db, { now: t1, mailer, batchSize: 2 });
    expect(up).toEqual({ sent: 5, retried: 0, failed: 0 });
    // a further run sends nothing again
    expect(await sendPending(db, { now: new Date(t1.getTime() + 3_600_000), mailer })).toEqual({ sent: 0, retried: 0, failed: 0 });
    mailer.close();

    all = await rows();
    const byTo = server.received.map((m) => m.to.join(",")).sort();
    expect(byTo).toEqual([1, 2, 3, 4, 5].map((n) => `reader${n}@example.test`));
    for (const row of all) {
      expect(row.status).toBe("sent");
      expect(row.attempts).toBe(2);
      expect(row.sent_at).not.toBeNull();
      expect(row.message_id).toBe(outboxMessageId(row.id));
      const got = server.received.filter((m) => m.outboxId === row.id);
      expect(got).toHaveLength(1);
      expect(got[0].subject).toBe(row.subject);
      expect(got[0].messageId).toBe(row.message_id);
      expect(got[0].text).toContain("Planning-level estimates");
    }
  });

  it("marks a row failed with its last error after the maximum attempts", async () => {
    const probe = await startMailServer({ port: 0 });
    const port = probe.port;
    await probe.close();
    const mailer = createMailer(`smtp://127.0.0.1:${port}`);
    await queue(9);
    let now = new Date();
    const seen: string[] = [];
    for (let attempt = 1; attempt <= 3; attempt++) {
      const report = await sendPending(db, { now, mailer, maxAttempts: 3, baseDelayMs: 1_000, maxDelayMs: 3_000 });
      const [row] = await rows();
      seen.push(row.status);
      expect(row.attempts).toBe(attempt);
      if (attempt < 3) {
        expect(report).toEqual({ sent: 0, retried: 1, failed: 0 });
        // 1 s, then 2 s: doubling
        expect(row.next_attempt_at.getTime() - now.getTime()).toBe(retryDelayMs(attempt, 1_000, 3_000));
        now = new Date(row.next_attempt_at.getTime() + 1);
      } else {
        expect(report).toEqual({ sent: 0, retried: 0, failed: 1 });
        expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);
      }
    }
    expect(seen).toEqual(["pending", "pending", "failed"]);
    // a failed row is kept, and never taken again
    expect(await sendPending(db, { now: new Date(now.getTime() + 86_400_000), mailer })).toEqual({ sent: 0, retried: 0, failed: 0 });
    mailer.close();
  });

  it("takes a row that another sender claimed only after that claim lapses", async () => {
    const server2 = await startMailServer({ port: 0 });
    const mailer = createMailer(`smtp://127.0.0.1:${server2.port}`);
    try {
      await queue(7);
      const t0 = new Date();
      // a sender that claimed the row and died before sending it
      await db.updateTable("email_outbox").set({ status: "sending", attempts: 1, next_attempt_at: new Date(t0.getTime() + 300_000) }).execute();
      expect(await sendPending(db, { now: t0, mailer })).toEqual({ sent: 0, retried: 0, failed: 0 });
      expect(await sendPending(db, { now: new Date(t0.getTime() + 300_001), mailer })).toEqual({ sent: 1, retried: 0, failed: 0 });
      expect(server2.received).toHaveLength(1);
      expect((await rows())[0]).toMatchObject({ status: "sent", attempts: 2 });
    } finally {
      mailer.close();
      await server2.close();
    }
  });

  it("lets two senders run side by side without sending a row twice", async () => {
    const server3 = await startMailServer({ port: 0 });
    const a = createMailer(`smtp://127.0.0.1:${server3.port}`);
    const b = createMailer(`smtp://127.0.0.1:${server3.port}`);
    try {
      for (let n = 1; n <= 12; n++) await queue(n);
      const [ra, rb] = await Promise.all([sendPending(db, { mailer: a, batchSize: 3 }), sendPending(db, { mailer: b, batchSize: 3 })]);
      expect(ra.sent + rb.sent).toBe(12);
      expect(server3.received).toHaveLength(12);
      expect(new Set(server3.received.map((m) => m.outboxId)).size).toBe(12);
    } finally {
      a.close();
      b.close();
      await server3.close();
    }
  });
});
