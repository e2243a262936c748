import Link from "next/link";
import { Wordmark } from "@/components/ui/logo";
import { VerdictCaution } from "@/components/ui/caution";

export default function LandingPage() {
  return (
    <main className="mx-auto max-w-prose px-4 py-12 sm:px-6 sm:py-16">
      <Wordmark />
      <h1 className="mt-10 text-4xl font-semibold leading-tight">Classification proofs, checked case by case.</h1>
      <p className="mt-6 text-lg text-stone-700">
        Draft a proof as a tree of cases. Close each case with a computation — a forbidden subgraph, a spectral radius bound, a positive vector — and Cairn
        re-does it in exact arithmetic and keeps the certificate. Referees vouch for or dispute individual steps; the finished proof leaves as a bundle anyone
        can re-check offline.
      </p>
      <div className="mt-8 flex flex-wrap gap-4">
        <Link href="/sign-in" className="rounded bg-lichen-600 px-5 py-2 font-semibold text-white hover:bg-lichen-700">
          Sign in
        </Link>
        <Link href="/proofs" className="rounded border border-stone-300 px-5 py-2 hover:bg-stone-100">
          Your proofs
        </Link>
      </div>
      <div className="mt-12">
        <VerdictCaution full />
      </div>
    </main>
  );
}
