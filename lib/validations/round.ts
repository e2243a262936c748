import { z } from "zod";
import { RECOMMENDATIONS } from "@/lib/review/rounds";

const markdown = (what: string) => z.string({ error: `Give the ${what} as text.` }).max(100_000, `Keep the ${what} under 100,000 characters.`);
const dueDate = z
  .string({ error: "Give the due date as a date, e.g. 2026-06-30." })
  .regex(/^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})?)?$/, "Give the due date as a date, e.g. 2026-06-30.")
  .refine((s) => !Number.isNaN(Date.parse(s)), "This is not a real date.");
const recommendation = z.enum(RECOMMENDATIONS, { error: "The recommendation is one of accept, minor_revision, major_revision, reject." });

/** An editor opens a round: its due date (a date alone means the end of that day, UTC). */
export const openRoundSchema = z.object({ dueAt: dueDate });
export type OpenRoundInput = z.infer<typeof openRoundSchema>;

/** An editor moves one referee's due date. */
export const refereeDueSchema = z.object({ dueAt: dueDate });

/** A referee saves their report as a draft; every field may still be incomplete. */
export const reportDraftSchema = z.object({
  body: markdown("report").optional(),
  recommendation: recommendation.nullish(),
  editorNote: markdown("note for the editors").optional(),
});
export type ReportDraftInput = z.infer<typeof reportDraftSchema>;

/** The editor's decision for a round, with the letter to the authors. */
export const decisionSchema = z.object({
  decision: z.enum(RECOMMENDATIONS, { error: "The decision is one of accept, minor_revision, major_revision, reject." }),
  letter: markdown("letter").refine((s) => s.trim().length > 0, "Write the letter to the authors."),
  attachReports: z.boolean({ error: "Say true or false." }).default(true),
});
export type DecisionInput = z.infer<typeof decisionSchema>;

/** Blind review and reminder offsets (days before / after a referee's due date; 0 = no reminder). */
export const reviewPolicySchema = z
  .object({
    blind: z.boolean({ error: "Say true or false." }).optional(),
    remindBeforeDays: z
      .number({ error: "Give a whole number of days." })
      .int("Give a whole number of days.")
      .min(0, "At least 0 days.")
      .max(60, "At most 60 days.")
      .optional(),
    remindAfterDays: z
      .number({ error: "Give a whole number of days." })
      .int("Give a whole number of days.")
      .min(0, "At least 0 days.")
      .max(60, "At most 60 days.")
      .optional(),
  })
  .refine((v) => v.blind !== undefined || v.remindBeforeDays !== undefined || v.remindAfterDays !== undefined, {
    message: "Change at least one of blind, remindBeforeDays, remindAfterDays.",
    path: ["body"],
  });
export type ReviewPolicyInput = z.infer<typeof reviewPolicySchema>;

/** A date alone ("2026-06-30") is the end of that day in UTC. */
export const parseDueDate = (s: string): Date => new Date(/^\d{4}-\d{2}-\d{2}$/.test(s) ? `${s}T23:59:59.000Z` : s);
