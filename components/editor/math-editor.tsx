"use client";
import dynamic from "next/dynamic";
import { cloneElement, isValidElement, useEffect, useMemo, useRef, type ComponentProps } from "react";
import "katex/dist/katex.min.css";
import { rehypePlugins, remarkPlugins } from "@/lib/markdown";
import { mathCommands, type Reference } from "./math-commands";

/**
 * The editor with its toolbar made accessible: each button is named by its aria-label, so the icons inside are
 * decoration (aria-hidden; the library's SVGs carry role="img" with no text). On a narrow screen it opens on the text
 * alone, with the preview one toolbar button away, instead of two half-width panes.
 */
const MDEditor = dynamic(
  () =>
    import("@uiw/react-md-editor").then(({ default: Editor, getCommands, getExtraCommands }) => {
      type Command = ReturnType<typeof getCommands>[number];
      const decorative = (c: Command): Command => {
        const icon = isValidElement<{ "aria-hidden"?: boolean }>(c.icon) ? cloneElement(c.icon, { "aria-hidden": true }) : c.icon;
        return Array.isArray(c.children) ? ({ ...c, icon, children: c.children.map(decorative) } as Command) : { ...c, icon };
      };
      const extraCommands = getExtraCommands().map(decorative);
      return function AccessibleEditor({ commands, ...props }: ComponentProps<typeof Editor>) {
        const narrow = typeof window !== "undefined" && window.matchMedia("(max-width: 639px)").matches;
        const toolbar = useMemo(() => (commands ?? getCommands()).map(decorative), [commands]);
        return <Editor commands={toolbar} extraCommands={extraCommands} preview={narrow ? "edit" : "live"} {...props} />;
      };
    }),
  { ssr: false, loading: () => <p className="text-stone-500">Loading the editor…</p> },
);

/**
 * The one editor for Markdown with math: statements and steps alike. The text is set in Cairn's mono face and
 * the preview in its text face, with the same math renderer as the pages (see .math-editor in globals.css).
 * `label` names the text area (the editor's toolbar buttons are not form controls to label). The toolbar is
 * math-first (components/editor/math-commands.tsx); `references` lists the cases and steps it may point to.
 */
export function MathEditor({
  value,
  onChange,
  label,
  hint,
  error,
  height = 240,
  references,
}: {
  value: string;
  onChange: (v: string) => void;
  label: string;
  hint?: string;
  error?: string;
  height?: number;
  references?: readonly Reference[];
}) {
  const commands = useMemo(() => mathCommands(references), [references]);
  const box = useRef<HTMLDivElement>(null);
  // The preview pane scrolls; keyboard users reach it with Tab and scroll it with the arrow keys. The library renders it
  // without a tabindex, so it is given one (and a name) once the editor is in the page.
  useEffect(() => {
    const mark = () =>
      box.current?.querySelectorAll<HTMLElement>(".w-md-editor-preview:not([tabindex])").forEach((el) => {
        el.tabIndex = 0;
        el.setAttribute("role", "region");
        el.setAttribute("aria-label", `Preview of ${label.toLowerCase()}`);
      });
    mark();
    const watch = new MutationObserver(mark);
    if (box.current) watch.observe(box.current, { childList: true, subtree: true });
    return () => watch.disconnect();
  }, [label]);
  return (
    <div ref={box} className="math-editor text-sm" data-color-mode="light">
      <p className="mb-1" aria-hidden="true">
        <span className="font-semibold">{label}</span>
        {hint && <span className="ml-2 text-stone-600">{hint}</span>}
      </p>
      <MDEditor
        value={value}
        onChange={(v) => onChange(v ?? "")}
        height={height}
        commands={commands}
        textareaProps={{ "aria-label": hint ? `${label} (${hint})` : label, "aria-invalid": error ? true : undefined }}
        previewOptions={{ remarkPlugins, rehypePlugins, skipHtml: true }}
      />
      {error && (
        <span role="alert" className="mt-1 block text-refuted">
          ✗ {error}
        </span>
      )}
    </div>
  );
}
