import { z } from "zod";
import { timeZoneSchema } from "./time-zone";

export const planProposeSchema = z.object({
  runId: z.uuid("runId must be a run id"),
  title: z.string().trim().min(3, "Give the plan a title").max(200),
  /**
   * The plan this one revises (it becomes that plan's next version); null starts a plan of
   * its own (version 1). Left out, the plan revises the newest plan from the same scenario.
   */
  revises: z.uuid("revises must be a plan id").nullable().optional(),
});
export type PlanPropose = z.infer<typeof planProposeSchema>;

const isoWithZone = z.iso.datetime({ offset: true, message: "Give a date-time with its offset, e.g. 2026-12-01T09:00:00-05:00" });

/** A review period; times carry their offset and the time zone is named, so nobody guesses. */
export const reviewOpenSchema = z
  .object({
    startsAt: isoWithZone,
    endsAt: isoWithZone,
    timeZone: timeZoneSchema,
  })
  .refine((v) => Date.parse(v.endsAt) > Date.parse(v.startsAt), { message: "The review must end after it starts", path: ["endsAt"] });
export type ReviewOpen = z.infer<typeof reviewOpenSchema>;

export const reviewExtendSchema = z.object({
  endsAt: isoWithZone,
  reason: z.string().trim().min(10, "Say why the review is extended (at least 10 characters)").max(2000),
});
export type ReviewExtend = z.infer<typeof reviewExtendSchema>;

/** Plain text with line breaks; rendered as text, never as HTML. */
export const commentSchema = z.object({
  body: z.string().trim().min(1, "Write a comment").max(10_000, "Comments are limited to 10 000 characters"),
});
export const responseSchema = z.object({
  response: z.string().trim().min(1, "Write the response").max(10_000),
});

/**
 * Publishing: threads with a comment and no response must each be acknowledged by the
 * lead, with a statement of why the plan is published without answering them.
 */
export const planPublishSchema = z.object({
  acknowledgedThreadIds: z.array(z.uuid("Each acknowledged thread must be a thread id")).max(1000).default([]),
  statement: z.string().trim().max(2000, "Keep the statement under 2 000 characters").default(""),
});
export type PlanPublish = z.infer<typeof planPublishSchema>;

/** The shortest statement a lead may give for publishing with threads unanswered. */
export const MIN_ACK_STATEMENT = 10;
