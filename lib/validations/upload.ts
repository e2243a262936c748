import { z } from "zod";
import { FILE_KINDS } from "@/lib/uploads/detect";

/** The query of an upload (the file itself is the raw body): its name, and optionally the kind the uploader means. */
export const uploadQuerySchema = z.object({
  name: z.string().trim().min(1, "give the file's name, e.g. ?name=trees-10.g6").max(255),
  kind: z.enum(FILE_KINDS, { message: `one of ${FILE_KINDS.join(", ")}` }).optional(),
});
