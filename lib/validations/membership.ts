import { z } from "./zod";

/** The editor changes which cases a referee reviews after the invitation (their sub-cases come with them). */
export const reviewerScopeSchema = z.object({
  caseIds: z
    .array(z.number({ error: "Give case ids as numbers." }).int().positive(), { error: "Give the chosen cases as a list of case ids." })
    .min(1, "Choose at least one case; to share the whole proof, use DELETE on this route.")
    .max(500),
});
export type ReviewerScopeInput = z.infer<typeof reviewerScopeSchema>;

/** The owner hands the proof to another member (an author or an editor). */
export const ownershipSchema = z.object({
  userId: z.number({ error: "Give the new owner's user id as a number." }).int().positive("Give the new owner's user id as a number."),
});
export type OwnershipInput = z.infer<typeof ownershipSchema>;
