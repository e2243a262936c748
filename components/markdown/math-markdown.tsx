import ReactMarkdown from "react-markdown";
import { rehypePlugins, remarkPlugins } from "@/lib/markdown";

/** Renders untrusted Markdown with math, sanitised (see lib/markdown.ts). Works on the server and the client. */
export function MathMarkdown({ source, className = "" }: { source: string; className?: string }) {
  return (
    <div className={`prose-math ${className}`}>
      <ReactMarkdown remarkPlugins={remarkPlugins} rehypePlugins={rehypePlugins} skipHtml>
        {source}
      </ReactMarkdown>
    </div>
  );
}
