import type { ClaimStatus } from "@/lib/review/states";
import { CAUTION_DOES_NOT, CAUTION_MEANS, recommendationWords, type DocCase, type DocRound, type ExportDocument } from "@/lib/export/document";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { ExportKindBadge } from "./export-kind-badge";
import { ScrollTable } from "@/components/ui/table-scroll";
import { ClaimInputs } from "@/components/claims/claim-inputs";
import { stepLabel } from "@/lib/proof-tree";

const when = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
const Heading = ({ depth, children }: { depth: number; children: React.ReactNode }) =>
  depth === 0 ? (
    <h2 className="mt-8 text-2xl font-semibold">{children}</h2>
  ) : depth === 1 ? (
    <h3 className="mt-6 text-xl font-semibold">{children}</h3>
  ) : (
    <h4 className="mt-5 text-lg font-semibold">{children}</h4>
  );
const isVerdict = (s: string): s is ClaimStatus => ["verified", "refuted", "undecided", "pending"].includes(s);

function CaseSection({ c }: { c: DocCase }) {
  return (
    <section data-case={c.number}>
      <Heading depth={c.depth}>
        Case {c.number}: {c.title}
      </Heading>
      <div className="flex flex-wrap items-baseline gap-2 text-sm">
        <em>Condition.</em>
        <MathMarkdown source={c.condition} />
      </div>
      <p className="text-xs text-stone-600">Case state: {c.state}</p>
      {c.steps.map((s) => (
        <article key={s.id} className="mt-4 break-inside-avoid" data-step={s.id}>
          <h5 className="font-semibold">
            Step {stepLabel(c.number, s.position)}{" "}
            <span className="text-sm font-normal text-stone-600">
              {s.revision ? `(revision ${s.revision.number}, by ${s.revision.authorName}, ${when(s.revision.savedAt)})` : "(no text saved)"}
            </span>
          </h5>
          {s.revision && <MathMarkdown source={s.revision.body} />}
          {s.claims.length > 0 && (
            <ul className="mt-2 space-y-1 text-sm">
              {s.claims.map((cl) => (
                <li key={cl.id} className="flex flex-wrap items-baseline gap-2">
                  {isVerdict(cl.status) && <VerdictBadge status={cl.status} />}
                  <span className="min-w-0 [overflow-wrap:anywhere]">{cl.sentence}</span>
                </li>
              ))}
            </ul>
          )}
          {s.openDisputes > 0 && (
            <p className="mt-1 text-sm text-refuted">
              ⚑ {s.openDisputes} open dispute{s.openDisputes > 1 ? "s" : ""} on this step.
            </p>
          )}
        </article>
      ))}
    </section>
  );
}

/** One section per claim with its inputs, as in the LaTeX appendix (lib/export/latex-inputs.ts). */
function ClaimInputsAppendix({ doc }: { doc: ExportDocument }) {
  const claims = doc.cases.flatMap((c) => c.steps.flatMap((s) => s.claims.map((cl) => ({ where: stepLabel(c.number, s.position), cl }))));
  if (claims.length === 0) return null;
  return (
    <section className="mt-10 break-before-page" data-testid="print-claim-inputs">
      <h2 className="text-2xl font-semibold">Appendix: claim inputs</h2>
      <p className="text-sm">
        Each claim with its inputs as entered and as graph6 (sparse6 for loops or multiple edges), and the vector its certificate carries. Large inputs are
        summarised by order, size, degree sequence and SHA-256; the bundle holds them in full.
      </p>
      {claims.map(({ where, cl }) => (
        <article key={cl.id} className="mt-4 break-inside-avoid" data-claim-item={cl.id}>
          <h3 className="font-semibold">
            Step {where}, {cl.id.replace(/^claim /, "claim ")}: {cl.statement || cl.kind}
          </h3>
          <p className="text-xs text-stone-600">
            Kind <span className="font-mono">{cl.kind}</span>.{" "}
            {cl.status === "pending"
              ? "Not checked yet."
              : `Decided ${cl.status} by ${cl.method || "an unnamed method"}; certificate: ${cl.certificateKind ?? "none (no decision to certify)"}.`}
          </p>
          <ClaimInputs inputs={cl.inputs} />
        </article>
      ))}
    </section>
  );
}

/** The review rounds and their decisions, as in the LaTeX source (referees as "Referee k" on a blind proof). */
function RoundsSection({ rounds }: { rounds: DocRound[] }) {
  if (rounds.length === 0) return null;
  return (
    <section className="mt-10" data-testid="print-rounds">
      <h2 className="text-2xl font-semibold">Review rounds and decisions</h2>
      {rounds.map((r) => (
        <div key={r.number} className="mt-4">
          <h3 className="text-xl font-semibold">Round {r.number}</h3>
          <p className="text-sm text-stone-700">
            opened {when(r.openedAt)}, due {when(r.dueAt)}
            {r.closedAt ? `, closed ${when(r.closedAt)}` : ""}.
          </p>
          {r.decision ? (
            <>
              <p>
                <strong>Decision: {recommendationWords(r.decision.decision)}</strong>, by {r.decision.editor}, {when(r.decision.decidedAt)}.
              </p>
              <MathMarkdown source={r.decision.letter} />
            </>
          ) : (
            <p className="italic">No decision yet.</p>
          )}
          {r.reports.length > 0 && (
            <ul className="list-disc pl-6 text-sm">
              {r.reports.map((p) => (
                <li key={p.referee}>
                  {p.referee} (report version {p.version}): recommends {recommendationWords(p.recommendation)}.
                </li>
              ))}
            </ul>
          )}
        </div>
      ))}
    </section>
  );
}

/** The exported document laid out for paper: the same content as the LaTeX source, from the same bundle. */
export function PrintDocument({ doc }: { doc: ExportDocument }) {
  const draft = doc.kind === "draft";
  const vouches = doc.cases.flatMap((c) =>
    c.steps.flatMap((s) =>
      s.vouches.map((a) => ({ step: stepLabel(c.number, s.position), ...a, stale: s.revision !== null && a.revision !== s.revision.number })),
    ),
  );
  return (
    <article className="print-document mx-auto max-w-prose bg-white p-8 print:p-0" data-testid="print-document">
      {/* Every printed page carries the export's kind in its top margin (CSS page margin boxes). */}
      <style>{`@page { size: A4; margin: 2cm 2cm 2.2cm; @top-center { content: ${draft ? '"DRAFT — not certified"' : '"Certified export"'}; font: ${draft ? "bold " : ""}10pt serif; } @bottom-center { content: "page " counter(page) " · manifest ${doc.manifestDigest.slice(0, 16)}…"; font: 8pt monospace; } }`}</style>
      {draft && (
        <p className="mb-4 border-2 border-undecided p-2 text-center font-semibold tracking-widest text-undecided" data-testid="draft-banner">
          △ DRAFT — not certified
        </p>
      )}
      <h1 className="text-3xl font-semibold">{doc.title}</h1>
      <p className="mt-2 flex flex-wrap items-center gap-2 text-sm text-stone-700">
        <ExportKindBadge kind={doc.kind} /> made {when(doc.exportedAt)} by {doc.exportedBy}; proof state at export: {doc.proofState}; checker{" "}
        {doc.checkerVersion}.
      </p>
      <p className="mt-1 text-xs">
        Manifest digest (SHA-256): <span className="break-all font-mono">{doc.manifestDigest}</span>
      </p>
      <aside className="mt-6 border-l-4 border-lichen-500 bg-lichen-50 px-4 py-2 text-sm print:bg-white" role="note" data-testid="print-caution">
        <strong>What the verdicts mean.</strong> {CAUTION_MEANS} <strong>{CAUTION_DOES_NOT}</strong>
      </aside>
      <h2 className="mt-8 text-2xl font-semibold">Statement</h2>
      <MathMarkdown source={doc.statement} />
      {doc.cases.map((c) => (
        <CaseSection key={c.number} c={c} />
      ))}
      <RoundsSection rounds={doc.rounds ?? []} />
      <ClaimInputsAppendix doc={doc} />
      <section className="mt-10 break-before-page">
        <h2 className="text-2xl font-semibold">Appendix: reviewers and vouches</h2>
        <p className="text-sm">
          Members: {doc.members.map((m) => `${m.name} (${m.role})`).join(", ")}. Each step needs {doc.requiredApprovals} approval
          {doc.requiredApprovals > 1 ? "s" : ""} at its latest revision.
        </p>
        <ScrollTable label="Approvals" headers={["Step", "Reviewer", "Vouched for revision", "Date"]} className="mt-3 w-full text-left text-sm">
          {vouches.length === 0 && (
            <tr>
              <td colSpan={4}>
                <em>No vouches recorded.</em>
              </td>
            </tr>
          )}
          {vouches.map((a) => (
            <tr key={`${a.step}-${a.reviewer}-${a.revision}`}>
              <td className="font-mono">{a.step}</td>
              <td>{a.reviewer}</td>
              <td>
                {a.revision}
                {a.stale ? " (superseded)" : ""}
              </td>
              <td>{when(a.at)}</td>
            </tr>
          ))}
        </ScrollTable>
      </section>
    </article>
  );
}
