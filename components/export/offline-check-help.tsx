/** How a reader re-checks a bundle with nothing but Node.js. */
export function OfflineCheckHelp({ proofId }: { proofId: number }) {
  return (
    <section className="space-y-2 rounded border border-stone-200 bg-white p-4 text-sm" aria-labelledby="offline">
      <h2 id="offline" className="text-lg font-semibold">
        Re-check a bundle offline
      </h2>
      <p>
        Download the{" "}
        <a className="text-lichen-700 underline" href={`/api/proofs/${proofId}/exports/checker`} download>
          self-contained checker (cairn-check.mjs)
        </a>{" "}
        and a bundle, then on any machine with Node.js 20 or later:
      </p>
      <pre className="overflow-x-auto rounded bg-stone-100 p-2 font-mono text-xs">node cairn-check.mjs cairn-proof-{proofId}-export-N-certified.json</pre>
      <p>
        It re-verifies every claim from scratch, re-checks every certificate, recomputes every item&apos;s SHA-256 and the manifest digest, prints one line per
        claim and a final line, and exits with 0 only if everything holds. Compare the manifest digest it prints with the one cited for the proof.
      </p>
    </section>
  );
}
