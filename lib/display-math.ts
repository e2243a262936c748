/**
 * `$$…$$` is display math wherever it is written, also inside one line of text, as TeX and the PDF export read it.
 * remark-math reads `$$x$$` within a line as inline math; this remark plugin marks such a node `math-display`,
 * which rehype-katex renders in display mode. The web pages, the print view and the editor preview share it
 * through lib/markdown.ts, so all three agree with the PDF.
 */
/** The part of a Markdown syntax-tree node (mdast) that the remark plugins here read and write. */
export interface MdNode {
  type: string;
  value?: string;
  children?: MdNode[];
  position?: { start: { offset?: number }; end: { offset?: number } };
  data?: { hName?: string; hProperties?: Record<string, unknown> };
}

function walk(node: MdNode, source: string) {
  if (node.type === "inlineMath") {
    const start = node.position?.start.offset;
    if (start !== undefined && source.startsWith("$$", start)) {
      node.data = { ...node.data, hProperties: { ...node.data?.hProperties, className: ["language-math", "math-display"] } };
    }
  }
  for (const child of node.children ?? []) walk(child, source);
}

export function remarkDisplayMathInline() {
  return (tree: MdNode, file: { value: unknown }) => walk(tree, String(file.value));
}
