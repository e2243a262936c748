/**
 * The editor's toolbar for writing mathematics: inline and display math, a reference to a case or a
 * step of this proof, a named graph, and the few text marks an argument needs (strong, emphasis, link,
 * quotation, lists, heading). No image, checklist or code-block buttons: a step is an argument, not a page.
 */
import {
  bold,
  divider,
  group,
  italic,
  link,
  orderedListCommand,
  quote,
  title,
  unorderedListCommand,
  type ExecuteState,
  type ICommand,
  type TextAreaTextApi,
} from "@uiw/react-md-editor/commands";

/** A case or step this text may point to: the label as the pages print it, and what it is. */
export interface Reference {
  label: string;
  /** The words inserted, e.g. "Case 2.1" or "Step 2.1(c)". */
  text: string;
}

/** The simply-laced Dynkin diagrams A_n, D_n, E6, E7, E8 (type, index), with the letter as the affine name writes it under a tilde. */
const SIMPLY_LACED = [
  ["A", "n", "Ã"],
  ["D", "n", "D̃"],
  ["E", "6", "Ẽ"],
  ["E", "7", "Ẽ"],
  ["E", "8", "Ẽ"],
] as const;

/**
 * Graphs with customary names (common practice: Dynkin and affine diagrams, paths, cycles, stars, star-like trees). The
 * affine diagrams are the Dynkin ones with a tilde (one more vertex each), so both come from one list.
 */
export const NAMED_GRAPH_SNIPPETS: ReadonlyArray<{ name: string; tex: string }> = [
  { name: "path P_n", tex: "P_{n}" },
  { name: "cycle C_n", tex: "C_{n}" },
  { name: "star K_{1,n}", tex: "K_{1,n}" },
  { name: "star-like tree T(p,q,r)", tex: "T(p,q,r)" },
  ...SIMPLY_LACED.map(([type, index]) => ({ name: `Dynkin ${type}_${index}`, tex: `${type}_{${index}}` })),
  ...SIMPLY_LACED.map(([type, index, tilde]) => ({ name: `affine ${tilde}_${index}`, tex: `\\tilde{${type}}_{${index}}` })),
];

/** `$…$` around the selection, or an empty formula with the cursor inside it. */
export function inlineMath(
  state: Pick<ExecuteState, "selectedText" | "selection">,
  api: Pick<TextAreaTextApi, "replaceSelection" | "setSelectionRange">,
): void {
  const body = state.selectedText;
  api.replaceSelection(`$${body}$`);
  if (!body) api.setSelectionRange({ start: state.selection.start + 1, end: state.selection.start + 1 });
}

/** `$$…$$` on lines of its own around the selection (display math, the same on the page and in the PDF). */
export function displayMath(
  state: Pick<ExecuteState, "text" | "selectedText" | "selection">,
  api: Pick<TextAreaTextApi, "replaceSelection" | "setSelectionRange">,
): void {
  const before = state.text.slice(0, state.selection.start);
  const lead = before === "" || before.endsWith("\n\n") ? "" : before.endsWith("\n") ? "\n" : "\n\n";
  const body = state.selectedText.trim();
  api.replaceSelection(`${lead}$$\n${body}\n$$\n`);
  if (!body) {
    const at = state.selection.start + lead.length + 3;
    api.setSelectionRange({ start: at, end: at });
  }
}

const insert = (text: string) => (_state: ExecuteState, api: TextAreaTextApi) => api.replaceSelection(text);

const glyph = (text: string) => (
  <span aria-hidden="true" className="font-mono text-xs">
    {text}
  </span>
);

/** The toolbar. References are offered only when the page hands some in (the proof's cases and steps). */
export function mathCommands(references: readonly Reference[] = []): ICommand[] {
  const commands: ICommand[] = [
    {
      name: "inline-math",
      keyCommand: "inline-math",
      shortcuts: "ctrlcmd+m",
      buttonProps: { "aria-label": "Inline math $x$: $…$ (Ctrl+M)", title: "Inline math $x$: $…$ (Ctrl+M)" },
      icon: glyph("$x$"),
      execute: inlineMath,
    },
    {
      name: "display-math",
      keyCommand: "display-math",
      buttonProps: { "aria-label": "Display math: $$…$$ on its own lines", title: "Display math: $$…$$ on its own lines" },
      icon: glyph("$$"),
      execute: displayMath,
    },
    group(
      NAMED_GRAPH_SNIPPETS.map((g) => ({
        name: `graph-${g.name}`,
        keyCommand: `graph-${g.name}`,
        buttonProps: { "aria-label": `Insert ${g.name}` },
        icon: <span>{g.name}</span>,
        execute: insert(`$${g.tex}$`),
      })),
      { name: "named-graph", groupName: "named-graph", buttonProps: { "aria-label": "Insert a named graph", title: "Insert a named graph" }, icon: glyph("Γ") },
    ),
  ];
  if (references.length > 0)
    commands.push(
      group(
        references.map((r) => ({
          name: `ref-${r.label}`,
          keyCommand: `ref-${r.label}`,
          buttonProps: { "aria-label": `Refer to ${r.text}` },
          icon: <span>{r.label}</span>,
          execute: insert(r.text),
        })),
        {
          name: "reference",
          groupName: "reference",
          buttonProps: { "aria-label": "Refer to a case or step of this proof", title: "Refer to a case or step of this proof" },
          icon: glyph("§"),
        },
      ),
    );
  return [...commands, divider, bold, italic, link, quote, unorderedListCommand, orderedListCommand, title];
}
