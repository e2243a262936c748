import type { ClaimStatus } from "@/models/claim";
import { CAUTION_DOES_NOT, CAUTION_MEANS, type DocCase, type ExportDocument } from "@/lib/export/document";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { ExportKindBadge } from "./export-kind-badge";
import { TableScroll } from "@/components/ui/table-scroll";

const when = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
const Heading = ({ depth, children }: { depth: number; children: React.ReactNode }) =>
  depth === 0 ? <h2 className="mt-8 text-2xl font-semibold">{children}</h2> : depth === 1 ? <h3 className="mt-6 text-xl font-semibold">{children}</h3> : <h4 className="mt-5 text-lg font-semibold">{children}</h4>;
const isVerdict = (s: string): s is ClaimStatus => ["verified", "refuted", "undecided", "pending"].includes(s);

function CaseSection({ c }: { c: DocCase }) {
  return (
    <section data-case={c.number}>
      <Heading depth={c.depth}>Case {c.number}: {c.title}</Heading>
      <div className="flex flex-wrap items-baseline gap-2 text-sm">
        <em>Condition.</em>
        <MathMarkdown source={c.condition} />
      </div>
      <p className="text-xs text-stone-600">Case state: {c.state}</p>
      {c.steps.map((s) => (
        <article key={s.id} className="mt-4 break-inside-avoid" data-step={s.id}>
          <h5 className="font-semibold">
            Step {c.number}:{s.position}{" "}
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
          {s.openDisputes > 0 && <p className="mt-1 text-sm text-refuted">⚑ {s.openDisputes} open dispute{s.openDisputes > 1 ? "s" : ""} on this step.</p>}
        </article>
      ))}
    </section>
  );
}

/** The exported document laid out for paper: the same content as the LaTeX source, from the same bundle. */
export function PrintDocument({ doc }: { doc: ExportDocument }) {
  const draft = doc.kind === "draft";
  const vouches = doc.cases.flatMap((c) => c.steps.flatMap((s) => s.vouches.map((a) => ({ step: `${c.number}:${s.position}`, ...a, stale: s.revision !== null && a.revision !== s.revision.number }))));
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
        <ExportKindBadge kind={doc.kind} /> made {when(doc.exportedAt)} by {doc.exportedBy}; proof state at export: {doc.proofState}; checker {doc.checkerVersion}.
      </p>
      <p className="mt-1 text-xs">
        Manifest digest (SHA-256): <span className="break-all font-mono">{doc.manifestDigest}</span>
      </p>
      <aside className="mt-6 border-l-4 border-lichen-500 bg-lichen-50 px-4 py-2 text-sm print:bg-white" role="note" data-testid="print-caution">
        <strong>What the verdicts mean.</strong> {CAUTION_MEANS} <strong>{CAUTION_DOES_NOT}</strong>
      </aside>
      <h2 className="mt-8 text-2xl font-semibold">Statement</h2>
      <MathMarkdown source={doc.statement} />
      {doc.cases.map((c) => <CaseSection key={c.number} c={c} />)}
      <section className="mt-10 break-before-page">
        <h2 className="text-2xl font-semibold">Appendix: reviewers and vouches</h2>
        <p className="text-sm">
          Members: {doc.members.map((m) => `${m.name} (${m.role})`).join(", ")}. Each step needs {doc.requiredApprovals} approval{doc.requiredApprovals > 1 ? "s" : ""} at its latest revision.
        </p>
        <TableScroll label="Approvals">
        <table className="mt-3 w-full text-left text-sm">
          <thead><tr><th>Step</th><th>Reviewer</th><th>Vouched for revision</th><th>Date</th></tr></thead>
          <tbody>
            {vouches.length === 0 && <tr><td colSpan={4}><em>No vouches recorded.</em></td></tr>}
            {vouches.map((a) => (
              <tr key={`${a.step}-${a.reviewer}-${a.revision}`}><td className="font-mono">{a.step}</td><td>{a.reviewer}</td><td>{a.revision}{a.stale ? " (superseded)" : ""}</td><td>{when(a.at)}</td></tr>
            ))}
          </tbody>
        </table>
        </TableScroll>
      </section>
    </article>
  );
}
