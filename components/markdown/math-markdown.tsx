import ReactMarkdown from "react-markdown";
import type { PluggableList } from "unified";
import { rehypePlugins, remarkPlugins } from "@/lib/markdown";

/**
 * Renders untrusted Markdown with math, sanitised (see lib/markdown.ts). Works on the server and the client.
 * `marks` adds remark plugins that only mark the text (the revision comparison's word marks).
 */
export function MathMarkdown({ source, className = "", marks = [] }: { source: string; className?: string; marks?: PluggableList }) {
  return (
    <div className={`prose-math ${className}`}>
      <ReactMarkdown remarkPlugins={marks.length ? [...remarkPlugins, ...marks] : remarkPlugins} rehypePlugins={rehypePlugins} skipHtml>
        {source}
      </ReactMarkdown>
    </div>
  );
}
