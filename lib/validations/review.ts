import { z } from "./zod";
import { NOTIFICATION_KINDS } from "@/models/notification";

const id = z.number({ error: "Give the id as a number." }).int().positive();

/** A verdict on one revision of a step; a dispute must say what is wrong. */
export const verdictSchema = z
  .object({
    revisionId: id,
    verdict: z.enum(["vouch", "dispute"], { error: "The verdict is either vouch or dispute." }),
    comment: z.string().max(20_000, "Keep the comment under 20,000 characters.").optional(),
    digest: z
      .string()
      .regex(/^[0-9a-f]{64}$/, "The digest is the 64 hex digits the review panel shows for the revision.")
      .optional(),
  })
  .refine((v) => v.verdict !== "dispute" || (v.comment ?? "").trim().length > 0, {
    path: ["comment"],
    message: "Say what is wrong: a dispute needs a comment.",
  });
export type VerdictInput = z.infer<typeof verdictSchema>;

export const disputeMoveSchema = z.object({
  to: z.enum(["answered", "withdrawn", "upheld"], { error: "Move a dispute to answered, withdrawn or upheld." }),
  comment: z.string().trim().max(20_000, "Keep the comment under 20,000 characters.").optional(),
});
export type DisputeMoveInput = z.infer<typeof disputeMoveSchema>;

export const settingsSchema = z.object({
  requiredApprovals: z
    .number({ error: "Give the number of vouches as a whole number." })
    .int("Give a whole number.")
    .min(1, "At least one approval is required.")
    .max(9, "At most 9 vouches can be required."),
});
export type SettingsInput = z.infer<typeof settingsSchema>;

export const emailPreferenceSchema = z.object({
  kind: z.enum(NOTIFICATION_KINDS, { error: `The kind is one of ${NOTIFICATION_KINDS.join(", ")}.` }),
  email: z.boolean({ error: "Say true or false." }),
});

export const markReadSchema = z.object({
  ids: z.union([z.literal("all"), z.array(id).min(1).max(500)], { error: 'Give "all" or a list of notification ids.' }),
});
