/**
 * Word-level marks for comparing two revisions typeset side by side. The word diff of the two sources
 * gives, for each side, the character ranges that changed; a remark plugin then wraps the text under
 * those ranges in <mark> elements (and a formula that changed as a whole), so both sides are typeset
 * exactly as the page typesets a step, with the changed words marked. Pure: no framework imports.
 */
import { diffWordsWithSpace } from "diff";
import type { MdNode } from "@/lib/display-math";

export interface Range {
  start: number;
  end: number;
}

export interface WordMarks {
  /** Ranges of the older text that the newer one no longer has. */
  removed: Range[];
  /** Ranges of the newer text that the older one did not have. */
  added: Range[];
  /** Words removed and added, for a one-line summary. */
  counts: { removed: number; added: number };
}

const words = (s: string) => (s.match(/\S+/g) ?? []).length;

/** The changed ranges of each side. Whitespace-only changes are not marked. */
export function wordMarks(before: string, after: string): WordMarks {
  const removed: Range[] = [];
  const added: Range[] = [];
  let a = 0,
    b = 0;
  const counts = { removed: 0, added: 0 };
  for (const part of diffWordsWithSpace(before, after)) {
    const len = part.value.length;
    const visible = /\S/.test(part.value);
    if (part.removed) {
      if (visible) (removed.push({ start: a, end: a + len }), (counts.removed += words(part.value)));
      a += len;
    } else if (part.added) {
      if (visible) (added.push({ start: b, end: b + len }), (counts.added += words(part.value)));
      b += len;
    } else {
      a += len;
      b += len;
    }
  }
  return { removed, added, counts };
}

const overlaps = (r: Range, start: number, end: number) => r.start < end && start < r.end;

const markNode = (children: MdNode[], className: string): MdNode => ({
  type: "changedWords",
  data: { hName: "mark", hProperties: { className: [className] } },
  children,
});

/** Splits a text node at the ranges it overlaps; the source offsets of text nodes match their value when no escape is involved. */
function splitText(node: MdNode, ranges: readonly Range[], className: string): MdNode[] {
  const start = node.position?.start.offset,
    end = node.position?.end.offset;
  const value = node.value ?? "";
  if (start === undefined || end === undefined) return [node];
  const hit = ranges.filter((r) => overlaps(r, start, end));
  if (hit.length === 0) return [node];
  // An escape (\$) or entity makes the source longer than the text: mark the whole node rather than guess.
  if (end - start !== value.length) return [markNode([node], className)];
  const out: MdNode[] = [];
  let at = 0;
  for (const r of hit) {
    const from = Math.max(0, r.start - start),
      to = Math.min(value.length, r.end - start);
    if (from > at) out.push({ type: "text", value: value.slice(at, from) });
    if (to > from) out.push(markNode([{ type: "text", value: value.slice(from, to) }], className));
    at = Math.max(at, to);
  }
  if (at < value.length) out.push({ type: "text", value: value.slice(at) });
  return out;
}

function walk(node: MdNode, ranges: readonly Range[], className: string): void {
  if (!node.children) return;
  node.children = node.children.flatMap((child) => {
    if (child.type === "text") return splitText(child, ranges, className);
    const start = child.position?.start.offset,
      end = child.position?.end.offset;
    // A formula or code span is one unit: marked whole when any of it changed.
    if ((child.type === "inlineMath" || child.type === "inlineCode") && start !== undefined && end !== undefined && ranges.some((r) => overlaps(r, start, end)))
      return [markNode([child], className)];
    if (child.type === "math" && start !== undefined && end !== undefined && ranges.some((r) => overlaps(r, start, end)))
      return [{ type: "changedBlock", data: { hName: "div", hProperties: { className: [`${className}-block`] } }, children: [child] }];
    walk(child, ranges, className);
    return [child];
  });
}

/** A remark plugin marking the given source ranges; `className` is "word-removed" or "word-added". */
export function remarkMarkRanges(options: { ranges: readonly Range[]; className: string }) {
  return (tree: MdNode) => {
    if (options.ranges.length > 0) walk(tree, options.ranges, options.className);
  };
}
