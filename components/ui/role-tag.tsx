import type { ProofRole } from "@/lib/access/rules";

const glyph: Record<ProofRole, string> = { author: "✎", reviewer: "⚖", editor: "◈" };

/** A member's role on a proof, with a glyph and a word (never colour alone). */
export function RoleTag({ role }: { role: ProofRole }) {
  return (
    <span className="inline-flex items-center gap-1 rounded border border-stone-300 bg-white px-2 py-0.5 font-mono text-xs text-stone-700" data-role={role}>
      <span aria-hidden="true">{glyph[role]}</span>
      {role}
    </span>
  );
}
