import Link from "next/link";

export default function StepNotFound() {
  return (
    <main>
      <h1 className="text-2xl font-semibold">No such step here</h1>
      <p className="mt-2 text-stone-600">It does not exist, its case was deleted, or you are not a member of this proof.</p>
      <Link href="/proofs" className="mt-4 inline-block text-lichen-700 underline">
        Back to your proofs
      </Link>
    </main>
  );
}
