/**
 * Verdicts and states are never told by colour alone: every mark renders a glyph (its shape) and the word, and within
 * one kind of mark no two values share a glyph, so a reader without colour (or a grey-scale print) still tells them apart.
 * The glyph is hidden from screen readers, which read the word.
 */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { VerdictBadge } from "@/components/claims/verdict-badge";
import { CaseStateBadge } from "@/components/proof/case-state-badge";
import { DisputeStateBadge, ProofStateBadge, VouchBadge } from "@/components/review/badges";
import type { CaseState, ClaimStatus, DisputeState, ProofState } from "@/lib/review/states";

/** Glyph and word of a rendered mark, read from its markup. */
function parts(html: string): { glyph: string; word: string; glyphHidden: boolean } {
  const glyph = /<span aria-hidden="true" class="mark-glyph[^"]*">([^<]+)<\/span>/.exec(html);
  const word = /<span class="mark-word">([^<]+)<\/span>/.exec(html);
  return { glyph: glyph?.[1] ?? "", word: word?.[1] ?? "", glyphHidden: glyph !== null };
}

const KINDS: Array<{ kind: string; values: string[]; render: (v: string) => React.ReactElement }> = [
  {
    kind: "verdict",
    values: ["pending", "verified", "refuted", "undecided"] satisfies ClaimStatus[],
    render: (v) => <VerdictBadge status={v as ClaimStatus} />,
  },
  {
    kind: "case state",
    values: ["drafting", "claim failing", "under review", "disputed", "settled"] satisfies CaseState[],
    render: (v) => <CaseStateBadge state={v as CaseState} />,
  },
  {
    kind: "dispute state",
    values: ["raised", "answered", "withdrawn", "upheld"] satisfies DisputeState[],
    render: (v) => <DisputeStateBadge state={v as DisputeState} />,
  },
  { kind: "proof state", values: ["in progress", "ready to certify"] satisfies ProofState[], render: (v) => <ProofStateBadge state={v as ProofState} /> },
  { kind: "vouch", values: ["current", "stale"], render: (v) => <VouchBadge stale={v === "stale"} /> },
];

describe("marks of verdicts and states", () => {
  it.each(KINDS)("$kind: every value has a glyph and its word, and no two values share a glyph", ({ values, render }) => {
    const seen = values.map((v) => parts(renderToStaticMarkup(render(v))));
    for (const [i, p] of seen.entries()) {
      expect(p.glyph.trim(), `glyph of ${values[i]}`).not.toBe("");
      expect(p.glyphHidden).toBe(true);
      expect(p.word.trim(), `word of ${values[i]}`).not.toBe("");
    }
    expect(new Set(seen.map((p) => p.glyph)).size).toBe(values.length);
    expect(new Set(seen.map((p) => p.word)).size).toBe(values.length);
  });

  it("says the state's own word for verdicts and states (the word, not only a colour class)", () => {
    expect(parts(renderToStaticMarkup(<VerdictBadge status="refuted" />)).word).toBe("refuted");
    expect(parts(renderToStaticMarkup(<CaseStateBadge state="claim failing" />)).word).toBe("claim failing");
    expect(parts(renderToStaticMarkup(<VouchBadge stale />)).word).toBe("superseded");
  });
});
