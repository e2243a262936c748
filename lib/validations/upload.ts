import { z } from "zod";
import { FILE_KINDS } from "@/lib/uploads/detect";

/** The query of an upload (the file itself is the raw body): its name, and optionally the kind the uploader means. */
export const uploadQuerySchema = z.object({
  name: z.string().trim().min(1, "give the file's name, e.g. ?name=trees-10.g6").max(255),
  kind: z.enum(FILE_KINDS, { message: `one of ${FILE_KINDS.join(", ")}` }).optional(),
});

/** Starting an upload in parts: the file's name, its total size, optionally its SHA-256 (checked at the finish) and the kind meant. */
export const partUploadSchema = z.object({
  name: z.string().trim().min(1, "give the file's name, e.g. trees-10.g6").max(255),
  size: z.number().int("a whole number of bytes").positive("the file's size in bytes (at least 1)").max(Number.MAX_SAFE_INTEGER),
  sha256: z
    .string()
    .regex(/^[0-9a-fA-F]{64}$/, "64 hexadecimal digits, or leave it out")
    .transform((s) => s.toLowerCase())
    .optional(),
  kind: z.enum(FILE_KINDS, { message: `one of ${FILE_KINDS.join(", ")}` }).optional(),
  /** A claim of the step the file is for (a supporting document or claims file of that claim). */
  claimId: z.number().int().positive().max(4294967295).optional(),
});
