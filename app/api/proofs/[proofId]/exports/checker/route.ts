import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { AppError } from "@/lib/errors";
import { download } from "@/lib/export/files";
import { checkerScript, CheckerUnavailableError } from "@/lib/export/checker-script";

type Context = { params: Promise<{ proofId: string }> };

/** The self-contained offline checker (one .mjs file, Node.js only) for this proof's bundles; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  await requireProofRole(proofId);
  try {
    return download(await checkerScript(), "text/javascript; charset=utf-8", "cairn-check.mjs");
  } catch (e) {
    if (e instanceof CheckerUnavailableError) throw new AppError("unavailable", e.message);
    throw e;
  }
});
