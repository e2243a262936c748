"use client";
import dynamic from "next/dynamic";
import "katex/dist/katex.min.css";
import { useMemo } from "react";
import { rehypePlugins, remarkPlugins } from "@/lib/markdown";
import { mathCommands, type Reference } from "./math-commands";

const MDEditor = dynamic(() => import("@uiw/react-md-editor"), { ssr: false, loading: () => <p className="text-stone-500">Loading the editor…</p> });

/**
 * The one editor for Markdown with math: statements and steps alike. The text is set in Cairn's mono face and
 * the preview in its text face, with the same math renderer as the pages (see .math-editor in globals.css).
 * `label` names the text area (the editor's toolbar buttons are not form controls to label). The toolbar is
 * math-first (components/editor/math-commands.tsx); `references` lists the cases and steps it may point to.
 */
export function MathEditor({ value, onChange, label, hint, error, height = 240, references }: {
  value: string;
  onChange: (v: string) => void;
  label: string;
  hint?: string;
  error?: string;
  height?: number;
  references?: readonly Reference[];
}) {
  const commands = useMemo(() => mathCommands(references), [references]);
  return (
    <div className="math-editor text-sm" data-color-mode="light">
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
