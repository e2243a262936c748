import type { ExportKind } from "@/lib/core/certificates/bundle";
import type { MarkLook } from "@/components/ui/mark";

const look: Record<ExportKind, MarkLook> = {
  certified: { glyph: "▲", tone: "border-verified/50 text-verified" },
  draft: { glyph: "△", tone: "border-undecided/50 text-undecided" },
};

/** Whether an export is certified or a draft, with a glyph and the word (never colour alone). */
export function ExportKindBadge({ kind }: { kind: ExportKind }) {
  const l = look[kind];
  return (
    <span className={`inline-flex items-center gap-1 rounded border bg-white px-2 py-0.5 font-mono text-xs ${l.tone}`} data-export-kind={kind}>
      <span aria-hidden="true">{l.glyph}</span>
      {kind}
    </span>
  );
}
