"use client";
import { useState } from "react";
import type { ClaimView } from "@/lib/data/claim-views";
import { GraphPicture } from "@/components/graph/graph-picture";
import { SpectrumPlot } from "@/components/graph/spectrum-plot";
import { apiFetch } from "@/components/proof/api-client";
import { VerdictBadge } from "./verdict-badge";
import { ClaimInputs, claimInputHref } from "./claim-inputs";
import { ClaimFiles } from "@/components/files/claim-files";

/** One claim: verdict, method, reason, certificate summary, who checked it with which checker, picture. */
export function ClaimCard(props: {
  claim: ClaimView;
  proofId: number;
  canRecheck: boolean;
  canWithdraw: boolean;
  onChanged: () => void;
  /** Set for those who may upload files: the part size above which uploads go in parts. */
  uploadPartSize?: number;
}) {
  const { claim, proofId, canRecheck, canWithdraw, onChanged } = props;
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const act = async (method: "POST" | "DELETE", path: string) => {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/proofs/${proofId}/claims/${claim.id}${path}`, { method });
      onChanged();
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  const recheck = () => act("POST", "/recheck");
  const withdraw = () => {
    if (window.confirm("Withdraw this claim? It stays in the history with your name, but no longer counts for the step, the case or an export."))
      void act("DELETE", "");
  };
  // The buttons at the end of the claim's top line, the first pushed to the right; one look for all.
  const actions = [
    canRecheck && claim.status !== "pending" && { label: "↻ Re-check", run: recheck },
    canRecheck && claim.status === "pending" && { label: "■ Cancel check", run: () => void act("POST", "/cancel") },
    canWithdraw && { label: "⨯ Withdraw", run: withdraw },
  ].filter((a) => a !== false);
  const first = claim.picture?.pictures[0];
  return (
    <li className="rounded border border-stone-200 bg-white p-4" data-testid="claim" data-claim-id={claim.id}>
      <div className="flex flex-wrap items-center gap-3">
        <VerdictBadge status={claim.status} />
        <span className="font-mono text-sm text-stone-500">{claim.kind}</span>
        <span className="font-semibold">{claim.statement ?? "being checked…"}</span>
        {actions.map((a, i) => (
          <button
            key={a.label}
            type="button"
            onClick={a.run}
            disabled={busy}
            className={`${i === 0 ? "ml-auto " : ""}rounded border border-stone-300 px-2 py-0.5 text-sm hover:bg-stone-100`}
          >
            {a.label}
          </button>
        ))}
      </div>
      <section aria-label="inputs" className="mt-2" data-testid="claim-card-inputs">
        <h4 className="text-xs uppercase tracking-wide text-stone-500">Inputs</h4>
        <ClaimInputs inputs={claim.inputs} download={claim.inputs.large ? claimInputHref(proofId, claim.id) : undefined} />
      </section>
      {claim.status === "pending" ? (
        <p className="mt-2 text-sm text-stone-600" aria-live="polite">
          {claim.progress?.parts
            ? `This claim is checked in ${claim.progress.parts.of} independent parts, shared among the verification workers: ${claim.progress.parts.done} of ${claim.progress.parts.of} parts done; ${
                claim.progress.parts.retrying?.length
                  ? `${claim.progress.parts.retrying.map((r) => r.words).join("; ")}. The verdict appears here when all are in; a part that fails on every attempt leaves the claim undecided with its reason, and a re-check runs it again.`
                  : "the verdict appears here when all are in."
              }`
            : claim.progress?.state === "checking"
              ? `A verification worker (${claim.progress.worker ?? "unnamed"}) is checking this claim; the verdict appears here when it is done.`
              : claim.progress?.state === "retrying"
                ? `This claim's check is being tried again (a worker stopped while checking it; attempt ${claim.progress.attempts + 1}); the verdict appears here when it is done.`
                : "This claim waits for a verification worker; the verdict appears here when it is done."}
        </p>
      ) : (
        <dl className="mt-2 grid grid-cols-[minmax(0,1fr)] gap-x-4 gap-y-1 text-sm sm:grid-cols-[9rem_minmax(0,1fr)]">
          <dt className="text-stone-500">method</dt>
          <dd data-testid="claim-method">
            {claim.method}
            {claim.certificateKind && <span className="text-stone-600"> · certificate: {claim.certificateKind}</span>}
          </dd>
          <dt className="text-stone-500">{claim.status === "undecided" ? "why undecided" : "why"}</dt>
          <dd className="[overflow-wrap:anywhere]">{claim.reason}</dd>
          <dt className="text-stone-500">certificate</dt>
          <dd>
            {claim.certificate ? (
              <details>
                <summary className="cursor-pointer">
                  {claim.certificate.summary} · <span className="font-mono">{claim.certificate.bytes}</span> bytes
                </summary>
                <pre className="mt-1 max-h-48 overflow-auto whitespace-pre-wrap break-all rounded bg-stone-100 p-2 font-mono text-xs">
                  {claim.certificate.preview}
                </pre>
              </details>
            ) : (
              "none (no decision to certify)"
            )}
          </dd>
          <dt className="text-stone-500">last checked</dt>
          <dd>
            {claim.checkedByName ?? "—"} · {claim.checkedAt?.slice(0, 16).replace("T", " ")} UTC · <span className="font-mono">{claim.checkerVersion}</span>
            {claim.decidedBy && <span className="font-mono text-stone-500"> · worker {claim.decidedBy}</span>}
          </dd>
          <dt className="text-stone-500">digest</dt>
          <dd className="break-all font-mono text-xs">{claim.digest}</dd>
        </dl>
      )}
      {error && (
        <p role="alert" className="mt-2 text-sm text-refuted">
          {error}
        </p>
      )}
      <ClaimFiles proofId={proofId} stepId={claim.stepId} claimId={claim.id} partSize={props.uploadPartSize} />
      {claim.picture && (
        <details className="mt-3" data-testid="claim-pictures">
          <summary className="cursor-pointer text-sm text-lichen-700">
            Pictures ({claim.picture.pictures.length} graph{claim.picture.pictures.length === 1 ? "" : "s"}
            {first?.spectrum ? " and the spectrum" : ""}; drawn in floating point, not part of the verdict)
          </summary>
          <div className="mt-3 grid grid-cols-[minmax(0,1fr)] gap-3 md:grid-cols-2">
            {claim.picture.pictures.map((p, i) => (
              <GraphPicture key={i} picture={p} />
            ))}
            {first?.spectrum && (
              <div className="md:col-span-2">
                <SpectrumPlot spectrum={first.spectrum} bound={claim.picture.bound} />
              </div>
            )}
            {claim.picture.note && <p className="text-sm text-stone-500">{claim.picture.note}</p>}
          </div>
        </details>
      )}
    </li>
  );
}
