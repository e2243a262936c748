"use client";
import { ClaimPanel } from "./claim-panel";
import { useState } from "react";
import { useSWRConfig } from "swr";
import { claimsFromDocument, describeClaimIssue, MAX_CLAIMS_PER_REQUEST } from "@/lib/validations/claim";
import { ApiError, apiFetch } from "@/components/proof/api-client";
import { FormField, FormProblem, SubmitRow } from "@/components/proof/form-field";

/**
 * Attaches every claim of a claims document at once — the same files the offline checker reads.
 * All or nothing: if any claim cannot be read, each problem is listed by claim and nothing is stored.
 */
export function ClaimFileForm({ proofId, stepId }: { proofId: number; stepId: number }) {
  const { mutate } = useSWRConfig();
  const [text, setText] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [problems, setProblems] = useState<string[]>([]);

  const readFile = async (file: File | undefined) => {
    if (file) setText(await file.text());
  };

  const submit = async (event: React.FormEvent) => {
    event.preventDefault();
    setMessage(null);
    setProblems([]);
    const read = claimsFromDocument(text);
    if ("problem" in read) return setProblems([read.problem]);
    setBusy(true);
    try {
      await apiFetch(`/api/proofs/${proofId}/steps/${stepId}/claims`, { method: "POST", body: { claims: read.claims } });
      setMessage(`Attached ${read.claims.length} ${read.claims.length === 1 ? "claim" : "claims"}. The checker is working on them; the verdicts appear above.`);
      setText("");
      await mutate(`/api/proofs/${proofId}/steps/${stepId}/claims`);
    } catch (e) {
      const issues = e instanceof ApiError ? (e.body.issues ?? []) : [];
      setProblems([(e as Error).message, ...issues.map((i) => describeClaimIssue(i.path, i.message, read.claims))]);
    } finally {
      setBusy(false);
    }
  };

  return (
    <ClaimPanel name="claim-file-form" title="Attach claims from a file" onSubmit={submit}>
      <p className="text-sm text-stone-600">
        One <code>cairn-claim/1</code> claim, an array of claims, or a <code>cairn-claims/1</code> list (up to {MAX_CLAIMS_PER_REQUEST}), as the offline checker
        reads them. All are attached or none.
      </p>
      <FormField label="Claims file">
        <input type="file" accept=".json,application/json" onChange={(e) => void readFile(e.target.files?.[0])} className="text-sm" />
      </FormField>
      <FormField label="or paste it here">
        <textarea
          value={text}
          onChange={(e) => setText(e.target.value)}
          rows={5}
          className="w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono text-sm"
          aria-label="claims document"
        />
      </FormField>
      {problems.length > 0 && (
        <div role="alert" className="space-y-1" data-testid="claim-file-problems">
          {problems.map((p, i) =>
            i === 0 ? (
              <FormProblem key={i} message={p} />
            ) : (
              <p key={i} className="font-mono text-xs text-refuted">
                ✗ {p}
              </p>
            ),
          )}
        </div>
      )}
      <SubmitRow label="Attach all" busyLabel="Checking the input…" busy={busy} message={message} />
    </ClaimPanel>
  );
}
