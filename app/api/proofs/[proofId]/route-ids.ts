import { idParam } from "@/lib/http";

const WHAT = {
  proofId: "This proof",
  caseId: "This case",
  stepId: "This step",
  claimId: "This claim",
  number: "This revision",
  round: "This round",
  reportId: "This report",
  userId: "This member",
  fileId: "This file",
  batchId: "This batch claim",
  uploadId: "This upload",
} as const;
type IdName = keyof typeof WHAT;

/** Parses every numeric id segment of a workspace route (`[proofId]`, `[stepId]`, …); nonsense is a 404 for that resource. */
export async function routeIds<P extends Partial<Record<IdName, string>>>(params: Promise<P>): Promise<{ [K in keyof P]: number }> {
  const p = await params;
  return Object.fromEntries(Object.entries(p).map(([k, v]) => [k, idParam(v as string, WHAT[k as IdName] ?? "This resource")])) as { [K in keyof P]: number };
}
