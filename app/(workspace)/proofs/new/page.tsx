import type { Metadata } from "next";
import { requireUser } from "@/lib/session";
import { NewProofForm } from "@/components/proof/new-proof-form";

export const metadata: Metadata = { title: "New proof" };

export default async function NewProofPage() {
  await requireUser();
  return (
    <main className="max-w-prose">
      <h1 className="text-3xl font-semibold">Start a proof</h1>
      <p className="mt-2 text-stone-600">You become its first author. Split it into cases and attach the computations that close them next.</p>
      <NewProofForm />
    </main>
  );
}
