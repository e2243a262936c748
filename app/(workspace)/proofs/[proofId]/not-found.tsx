import Link from "next/link";

export default function ProofNotFound() {
  return (
    <main>
      <h1 className="text-2xl font-semibold">No such proof here</h1>
      <p className="mt-2 text-stone-600">It does not exist, or you are not one of its members.</p>
      <Link href="/proofs" className="mt-4 inline-block text-lichen-700 underline">
        Back to your proofs
      </Link>
    </main>
  );
}
