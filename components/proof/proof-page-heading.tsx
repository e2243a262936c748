import Link from "next/link";
import type { ReactNode } from "react";

/** The head of a page about one proof: the way back to the proof, the page's title, and what follows it. */
export function ProofPageHeading({ proofId, proofTitle, title, children }: { proofId: number; proofTitle: string; title: string; children?: ReactNode }) {
  return (
    <div>
      <Link href={`/proofs/${proofId}`} className="text-sm text-lichen-700 underline">
        ← {proofTitle}
      </Link>
      <h1 className="mt-2 text-3xl font-semibold">{title}</h1>
      {children}
    </div>
  );
}
