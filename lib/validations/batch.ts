import { z } from "zod";
import { RELATIONS } from "@/lib/core/claims/claim-schema";

/** A batch claim over a graph list uploaded to the step: every graph satisfies ρ(G) op bound. */
export const createBatchSchema = z.object({
  fileId: z.number({ message: "choose an uploaded graph list" }).int().positive(),
  kind: z.literal("spectral-radius-bound").default("spectral-radius-bound"),
  op: z.enum(RELATIONS, { message: `one of ${RELATIONS.join(" ")}` }),
  bound: z.string().trim().min(1, "give the bound, e.g. 2 or sqrt(2+sqrt(5))").max(500),
});
export type CreateBatchInput = z.infer<typeof createBatchSchema>;
