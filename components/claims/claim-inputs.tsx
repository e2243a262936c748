import type { ClaimInputsView, GraphInputView, InputEntry } from "@/lib/core/claims/claim-display";

/** A code text that wraps anywhere (graph6, vectors, edge lists). */
function Code({ text, label }: { text: string; label?: string }) {
  return (
    <pre aria-label={label} className="mt-1 max-h-48 overflow-auto whitespace-pre-wrap break-all rounded bg-stone-100 p-2 font-mono text-xs">
      {text}
    </pre>
  );
}

function GraphInput({ g, download }: { g: GraphInputView; download?: string }) {
  return (
    <div data-testid="input-graph" data-graph={g.name}>
      {g.order !== null && (
        <p>
          order {g.order}, size {g.size}
          {g.loops ? `, ${g.loops} loop${g.loops > 1 ? "s" : ""}` : ""}; degree sequence <span className="font-mono">{g.degreeSequence}</span>
        </p>
      )}
      {g.problem && <p className="text-stone-600">not read for display: {g.problem}</p>}
      {g.entered !== null && (
        <div>
          <span className="text-stone-500">as entered ({g.format})</span>
          <Code text={g.entered} label={`${g.name} as entered`} />
        </div>
      )}
      {g.encoded !== null && (
        <div>
          <span className="text-stone-500">as {g.encoding}</span>
          <Code text={g.encoded} label={`${g.name} as ${g.encoding}`} />
        </div>
      )}
      {g.large && (
        <p data-testid="input-summary">
          Large input ({g.enteredCharacters} characters as entered{g.encodedCharacters ? `, ${g.encodedCharacters} as ${g.encoding}` : ""}): shown as a summary.
          SHA-256 of the {g.encoding ?? "text"} <span className="break-all font-mono text-xs">{g.digest}</span>.{" "}
          {download ? (
            <a href={download} className="text-lichen-700 underline" download>
              Download the full input
            </a>
          ) : (
            "The full input is in the bundle."
          )}
        </p>
      )}
    </div>
  );
}

function Entry({ e, download }: { e: InputEntry; download?: string }) {
  if (e.type === "text") return <span className="font-mono">{e.text}</span>;
  if (e.type === "graph") return <GraphInput g={e.graph} download={download} />;
  if (e.entries) return <Code text={e.entries.join(", ")} label={e.label} />;
  return (
    <p data-testid="input-summary">
      {e.count} entries, shown as a summary; SHA-256 of the entries (one per line) <span className="break-all font-mono text-xs">{e.digest}</span>.{" "}
      {download ? (
        <a href={download} className="text-lichen-700 underline" download>
          Download the full input
        </a>
      ) : (
        "The full list is in the bundle."
      )}
    </p>
  );
}

/**
 * A claim's inputs as lib/core/claims/claim-display.ts gives them, the same on the claim card, in the claims
 * table and in the print view. `download` is the address of the full input (web pages); without it the
 * summary points to the bundle (print view).
 */
export function ClaimInputs({ inputs, download }: { inputs: ClaimInputsView; download?: string }) {
  return (
    <div data-testid="claim-inputs" className="text-sm">
      {inputs.problem && <p className="text-refuted">The stored input is not a readable claim: {inputs.problem}</p>}
      <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[11rem_1fr]">
        {inputs.entries.map((e, i) => (
          <div key={i} className="contents">
            <dt className="text-stone-500">{e.label}</dt>
            <dd className="min-w-0 break-words">
              <Entry e={e} download={download} />
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

/** The short form of a table cell, expandable to the full inputs. */
export function ClaimInputsShort({ inputs, download }: { inputs: ClaimInputsView; download?: string }) {
  return (
    <details data-testid="claim-inputs-short">
      <summary className="cursor-pointer font-mono text-xs">{inputs.short}</summary>
      <div className="mt-1">
        <ClaimInputs inputs={inputs} download={download} />
      </div>
    </details>
  );
}

/** The address of a claim's full stored input. */
export const claimInputHref = (proofId: number, claimId: number) => `/api/proofs/${proofId}/claims/${claimId}/input`;
