import { z } from "./zod";

/** A comment on a step, a reply to one (parentId), or a post in a dispute's thread (reviewId). Markdown with math. */
export const commentSchema = z.object({
  body: z.string().trim().min(1, "Write something first.").max(20_000, "Keep the comment under 20,000 characters."),
  parentId: z.number().int().positive().nullish(),
  reviewId: z.number().int().positive().nullish(),
});
export type CommentInput = z.infer<typeof commentSchema>;
