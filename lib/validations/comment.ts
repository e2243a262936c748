import { z } from "./zod";

/** A comment on a step, a reply to one (parentId), or a post in a dispute's thread (reviewId). Markdown with math. */
export const commentSchema = z.object({
  body: z.string().trim().min(1, "Write something first.").max(20_000, "Keep the comment under 20,000 characters."),
  parentId: z.number().int().positive().nullish(),
  reviewId: z.number().int().positive().nullish(),
});
export type CommentInput = z.infer<typeof commentSchema>;

/** A comment (or reply) on the statement or on a case's condition; `digest` is the text's digest the writer read (a changed text is refused). */
export const placeCommentSchema = z.object({
  body: commentSchema.shape.body,
  parentId: z.number().int().positive().nullish(),
  digest: z
    .string()
    .regex(/^[0-9a-f]{64}$/, "The digest is the 64 hexadecimal characters the thread was read with.")
    .nullish(),
});
export type PlaceCommentInput = z.infer<typeof placeCommentSchema>;
