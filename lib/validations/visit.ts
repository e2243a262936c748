import { z } from "./zod";

/** "Mark as seen": the moment up to which the member has seen the changes (the newest change the page listed). */
export const markSeenSchema = z.object({
  through: z.iso.datetime({ offset: true, error: "Give the moment as an ISO date and time, e.g. 2026-03-01T12:00:00.000Z." }),
});
export type MarkSeenInput = z.infer<typeof markSeenSchema>;
