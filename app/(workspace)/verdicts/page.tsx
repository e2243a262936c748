import type { Metadata } from "next";

export const metadata: Metadata = { title: "What a verdict means" };

/** The full text behind the one-line note that every page with verdicts shows. */
export default function VerdictsPage() {
  return (
    <main className="max-w-prose space-y-4">
      <h1 className="text-3xl font-semibold">What a verdict means</h1>
      <p>
        Every claim attached to a step carries a <strong>verdict</strong>, decided by a named <strong>method</strong>:
      </p>
      <dl className="space-y-3">
        <div>
          <dt className="font-semibold">✓ verified</dt>
          <dd>
            Cairn’s checker re-did the stated computation on the stated input with exact arithmetic (integers, rationals, Sturm sequences, exact inertia; never
            floating point), and stored a certificate that re-checks independently, also offline with the exported checker.
          </dd>
        </div>
        <div>
          <dt className="font-semibold">✗ refuted</dt>
          <dd>The same exact computation shows the claim false; the certificate holds the counter-evidence.</dd>
        </div>
        <div>
          <dt className="font-semibold">? undecided</dt>
          <dd>The checker could not decide within its limits; the reason is shown with the claim. It is not a verdict either way.</dd>
        </div>
      </dl>
      <h2 className="mt-8 text-xl font-semibold">What a verdict does not cover</h2>
      <ul className="list-disc space-y-2 pl-6">
        <li>That the case split is exhaustive: a verified claim speaks for its case only (a coverage claim speaks only for the enumeration it names).</li>
        <li>That the prose argument is right, or that the claim’s input is the graph the argument needs.</li>
        <li>Pictures, Perron vector values and spectra drawn beside a claim: they are floating-point display aids, never evidence.</li>
      </ul>
      <p>
        Those stay with the authors and the referees. A referee’s vouch covers one revision of a step, text and claims together; a <em>certified</em> export
        says that every case was settled when it was made, and nothing more.
      </p>
    </main>
  );
}
