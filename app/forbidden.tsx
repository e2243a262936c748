import Link from "next/link";

/** Shown with HTTP 403 when a member opens a page their standing on the proof does not allow (lib/access/rules.ts). */
export default function Forbidden() {
  return (
    <main className="mx-auto max-w-prose p-8">
      <h1 className="text-2xl font-semibold">Not open to you</h1>
      <p className="mt-2 text-stone-600">
        Your role on this proof does not include this page. A reviewer invited to chosen cases sees those cases only, not exports or the whole proof; ask an
        editor of the proof to share the whole proof with you.
      </p>
      <Link href="/proofs" className="mt-4 inline-block text-lichen-700 underline">
        Back to your proofs
      </Link>
    </main>
  );
}
