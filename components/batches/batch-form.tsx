"use client";
import { useState } from "react";
import useSWR, { useSWRConfig } from "swr";
import { ApiError, apiFetch, jsonFetcher } from "@/components/proof/api-client";
import { FormProblem, SubmitRow } from "@/components/proof/form-field";
import type { StepFileView } from "@/lib/data/files";
import { Choice, type ChoiceOption } from "@/components/ui/choice";
import { TextInput } from "@/components/ui/text-input";

const OPS = ["<", "<=", "=", ">=", ">"] as const;
const SHOWN: Record<(typeof OPS)[number], string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

/** The inline selects of the form's sentence. */
const inline = "rounded border border-stone-300 bg-white px-1 py-0.5";

type Kind = "spectral-radius-bound" | "contains-one-of" | "contains-none-of" | "identified-as" | "enumeration-exactly";
const KINDS: Record<Kind, string> = {
  "spectral-radius-bound": "has ρ(G)",
  "contains-one-of": "contains one of",
  "contains-none-of": "contains none of",
  "identified-as": "is identified as a member of",
  "enumeration-exactly": "— the list is exactly, up to isomorphism, the enumeration of",
};
/** Which graphs an enumeration statement lists. */
const SETTINGS: ChoiceOption[] = [
  ["tree", "trees"],
  ["simple", "connected simple graphs"],
  ["multigraph", "connected graphs with loops and multiple edges"],
];
/** An enumeration statement may keep only the graphs with ρ(G) below the bound. */
const LIMITS: ChoiceOption[] = [
  ["", "(all of them)"],
  ["<", "with ρ(G) <"],
  ["<=", "with ρ(G) ≤"],
];
/** Families of Smith's classification, as lib/core/smith-families.ts names them, with their display. */
const FAMILIES: Array<[string, string]> = [
  ["A", "A"],
  ["D", "D"],
  ["E", "E"],
  ["A~", "Ã"],
  ["D~", "D̃"],
  ["E~", "Ẽ"],
  ["loop_path", "loop_path"],
  ["loop_path2", "loop_path2"],
  ["fork_loop", "fork_loop"],
];

/** A whole number inside the form's sentence. */
function Count({ value, onValue, label, width }: { value: string; onValue: (v: string) => void; label: string; width: string }) {
  return (
    <TextInput
      value={value}
      onValue={onValue}
      aria-label={label}
      inputMode="numeric"
      className={`${width} rounded border border-stone-300 px-2 py-0.5 font-mono`}
    />
  );
}

/** The request body for the statement chosen in the form. */
function statementBody(
  kind: Kind,
  op: string,
  bound: string,
  patterns: string,
  induced: boolean,
  families: string[],
  setting: string,
  vertices: string,
  limitOp: string,
  weights: { maxMultiplicity: string; maxLoop: string },
) {
  if (kind === "spectral-radius-bound") return { kind, op, bound };
  // Optionally only those with ρ(G) < b (or ≤ b), with the bound field's value.
  if (kind === "enumeration-exactly")
    return {
      kind,
      setting,
      vertices: Number(vertices),
      ...(setting === "multigraph" ? { maxMultiplicity: Number(weights.maxMultiplicity), maxLoop: Number(weights.maxLoop) } : {}),
      ...(limitOp ? { op: limitOp, bound } : {}),
    };
  if (kind === "identified-as") return { kind, families };
  return {
    kind,
    induced,
    patterns: patterns
      .split("\n")
      .map((p) => p.trim())
      .filter(Boolean),
  };
}

/** Starts a batch claim: every graph of an uploaded graph list satisfies ρ(G) op b, contains one / none of some patterns, or is identified as a family member. */
export function BatchForm({ proofId, stepId }: { proofId: number; stepId: number }) {
  const { mutate } = useSWRConfig();
  const { data } = useSWR<{ files: StepFileView[] }>(`/api/proofs/${proofId}/steps/${stepId}/files`, jsonFetcher);
  const lists = (data?.files ?? []).filter((f) => f.kind === "graph-list");
  const [fileId, setFileId] = useState<string>("");
  const [op, setOp] = useState<(typeof OPS)[number]>("<");
  const [bound, setBound] = useState("2");
  const [kind, setKind] = useState<Kind>("spectral-radius-bound");
  const [patterns, setPatterns] = useState("star(3)");
  const [induced, setInduced] = useState(false);
  const [families, setFamilies] = useState<string[]>(["A", "D", "E"]);
  const [setting, setSetting] = useState("tree");
  const [vertices, setVertices] = useState("10");
  const [limitOp, setLimitOp] = useState("");
  const [maxMultiplicity, setMaxMultiplicity] = useState("2");
  const [maxLoop, setMaxLoop] = useState("1");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | undefined>();

  const boundField = <TextInput value={bound} onValue={setBound} aria-label="bound" className="w-40 rounded border border-stone-300 px-2 py-0.5 font-mono" />;
  const chosen = fileId || (lists[0] ? String(lists[0].id) : "");
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(undefined);
    setMessage(null);
    setBusy(true);
    try {
      const { batch, queued } = await apiFetch<{ batch: { total: number }; queued: boolean }>(`/api/proofs/${proofId}/steps/${stepId}/batches`, {
        method: "POST",
        body: {
          fileId: Number(chosen),
          ...statementBody(kind, op, bound, patterns, induced, families, setting, vertices, limitOp, { maxMultiplicity, maxLoop }),
        },
      });
      setMessage(
        `Started over ${batch.total} graphs.${queued ? "" : " The job queue cannot be reached right now: the batch waits and starts when it is back."}`,
      );
      await mutate(`/api/proofs/${proofId}/steps/${stepId}/batches`);
    } catch (err) {
      const issues = err instanceof ApiError ? (err.body.issues ?? []) : [];
      setProblem([(err as Error).message, ...issues.map((i) => `${i.path}: ${i.message}`)].join(" "));
    } finally {
      setBusy(false);
    }
  };

  if (lists.length === 0) return <p className="mt-3 text-sm text-stone-600">Upload a graph list to this step to claim something of every graph in it.</p>;
  return (
    <form onSubmit={submit} className="mt-4 space-y-3 rounded border border-stone-200 bg-white p-4" aria-labelledby="batch-heading" data-testid="batch-form">
      <h3 id="batch-heading" className="font-semibold">
        Claim something of every graph in a list
      </h3>
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <span>Every graph of</span>
        <Choice
          value={chosen}
          onChange={(e) => setFileId(e.target.value)}
          aria-label="graph list"
          className={inline}
          options={lists.map((f) => [String(f.id), `${f.name} (${f.graphCount} graphs)`])}
        />
        <Choice value={kind} onChange={(e) => setKind(e.target.value as Kind)} aria-label="statement" className={inline} options={Object.entries(KINDS)} />
        {kind === "spectral-radius-bound" && (
          <>
            <Choice
              value={op}
              onChange={(e) => setOp(e.target.value as (typeof OPS)[number])}
              aria-label="relation"
              className={inline}
              options={OPS.map((o) => [o, SHOWN[o]])}
            />
            {boundField}
          </>
        )}
      </div>
      {(kind === "contains-one-of" || kind === "contains-none-of") && (
        <div className="space-y-1 text-sm">
          <textarea
            value={patterns}
            onChange={(e) => setPatterns(e.target.value)}
            aria-label="patterns, one per line"
            rows={3}
            className="w-full rounded border border-stone-300 px-2 py-1 font-mono"
          />
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={induced} onChange={(e) => setInduced(e.target.checked)} /> as induced subgraphs
          </label>
        </div>
      )}
      {kind === "enumeration-exactly" && (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span>the</span>
          <Choice value={setting} onChange={(e) => setSetting(e.target.value)} aria-label="which graphs" className={inline} options={SETTINGS} />
          {setting === "multigraph" && (
            <>
              {(
                [
                  ["of multiplicity ≤", "largest edge multiplicity", maxMultiplicity, setMaxMultiplicity],
                  ["and loop weight ≤", "largest loop weight", maxLoop, setMaxLoop],
                ] as const
              ).map(([words, label, value, set]) => (
                <label key={label} className="flex items-center gap-2">
                  {words}
                  <Count value={value} onValue={set} label={label} width="w-12" />
                </label>
              ))}
            </>
          )}
          <span>on</span>
          <Count value={vertices} onValue={setVertices} label="vertices" width="w-16" />
          <span>vertices</span>
          <Choice value={limitOp} onChange={(e) => setLimitOp(e.target.value)} aria-label="only those with ρ(G)" className={inline} options={LIMITS} />
          {limitOp && boundField}
        </div>
      )}
      {kind === "identified-as" && (
        <fieldset className="flex flex-wrap gap-3 text-sm">
          <legend className="sr-only">families</legend>
          {FAMILIES.map(([name, shown]) => (
            <label key={name} className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={families.includes(name)}
                onChange={(e) => setFamilies(e.target.checked ? [...families, name] : families.filter((f) => f !== name))}
              />
              {shown}
            </label>
          ))}
        </fieldset>
      )}
      <FormProblem message={problem} />
      <SubmitRow label="Check every graph" busyLabel="Starting…" busy={busy} message={message} />
    </form>
  );
}
