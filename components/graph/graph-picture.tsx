"use client";
import { useId, useState } from "react";
import type { GraphPicture as Picture } from "@/lib/verification/picture";

const R = 13;

/**
 * A claim's graph as SVG, laid out on the server by its structure (lib/verification/layout.ts). The embedding's image,
 * when there is one, is drawn thick and filled; Perron vector values appear on request (floats,
 * display only).
 */
export function GraphPicture({ picture }: { picture: Picture }) {
  const [showPerron, setShowPerron] = useState(false);
  const lit = new Set(picture.highlight?.vertices ?? []);
  const litEdge = new Set((picture.highlight?.edges ?? []).map(([u, v]) => `${Math.min(u, v)}-${Math.max(u, v)}`));
  const big = picture.n > 60;
  const r = big ? 6 : R;
  // Frame the drawing tightly, so a small graph fills its box instead of floating in it.
  const pad = 40;
  const [x0, x1] = [Math.min(...picture.x) - pad, Math.max(...picture.x) + pad];
  const [y0, y1] = [Math.min(...picture.y) - pad, Math.max(...picture.y) + pad];
  const w = Math.max(x1 - x0, 240),
    h = Math.max(y1 - y0, 160);
  const viewBox = picture.n === 0 ? "0 0 1000 700" : `${(x0 + x1 - w) / 2} ${(y0 + y1 - h) / 2} ${w} ${h}`;
  const words = picture.summary ?? `${picture.n} vertices, ${picture.edges.filter(([u, v]) => u !== v).length} edges`;
  const titleId = useId(),
    descId = useId();
  return (
    <figure className="rounded border border-stone-200 bg-white p-2" data-testid="graph-picture">
      <figcaption className="flex flex-wrap items-center justify-between gap-2 px-1 text-sm">
        <span>
          {picture.title} · <span className="font-mono">{picture.n}</span> vertices
          {picture.highlight && <span className="ml-2 text-lichen-700">■ thick and filled: the embedding’s image</span>}
        </span>
        {picture.perron && (
          <label className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={showPerron} onChange={(e) => setShowPerron(e.target.checked)} />
            Perron vector values (display only)
          </label>
        )}
      </figcaption>
      <svg viewBox={viewBox} className="mx-auto h-auto max-h-80 w-full" role="img" aria-labelledby={titleId} aria-describedby={descId}>
        <title id={titleId}>{`${picture.title}: a drawing of the graph`}</title>
        <desc id={descId}>
          {words}
          {picture.graph6 ? `; graph6 ${picture.graph6}` : ""}
          {picture.highlight ? `; the embedding's image is vertices ${picture.highlight.vertices.map((v) => picture.labels[v]).join(", ")}` : ""}
        </desc>
        {picture.edges.map(([u, v, m], i) => {
          const on = litEdge.has(`${Math.min(u, v)}-${Math.max(u, v)}`);
          if (u === v) return <circle key={i} cx={picture.x[u]} cy={picture.y[u] - r - 6} r={8} fill="none" stroke="#7d766a" strokeWidth={2} />;
          return (
            <g key={i}>
              <line x1={picture.x[u]} y1={picture.y[u]} x2={picture.x[v]} y2={picture.y[v]} stroke={on ? "#1d5044" : "#a29b8c"} strokeWidth={on ? 6 : 2} />
              {m > 1 && (
                <text
                  x={(picture.x[u] + picture.x[v]) / 2}
                  y={(picture.y[u] + picture.y[v]) / 2 - 6}
                  fontSize={16}
                  textAnchor="middle"
                  className="font-mono"
                  fill="#48433c"
                >
                  ×{m}
                </text>
              )}
            </g>
          );
        })}
        {picture.x.map((x, v) => (
          <g key={v} data-highlighted={lit.has(v) ? "true" : undefined}>
            <circle
              cx={x}
              cy={picture.y[v]}
              r={r}
              fill={lit.has(v) ? "#2f7d6b" : "#ffffff"}
              stroke={lit.has(v) ? "#1d5044" : "#5f594f"}
              strokeWidth={lit.has(v) ? 3 : 2}
            />
            {!big && (
              <text x={x} y={picture.y[v] + 5} fontSize={13} textAnchor="middle" className="font-mono" fill={lit.has(v) ? "#ffffff" : "#322f2a"}>
                {picture.labels[v]}
              </text>
            )}
            {showPerron && picture.perron && (
              <text x={x + r + 2} y={picture.y[v] - r} fontSize={big ? 10 : 14} className="font-mono" fill="#8a6a12" data-testid="perron-value">
                {picture.perron[v].toFixed(3)}
              </text>
            )}
          </g>
        ))}
      </svg>
      <details className="px-1 text-xs text-stone-700" data-testid="graph-in-words">
        <summary className="cursor-pointer">The graph in words</summary>
        <p className="mt-1">{words}.</p>
        {picture.graph6 && (
          <p className="mt-1">
            graph6: <code className="break-all font-mono">{picture.graph6}</code>
          </p>
        )}
      </details>
    </figure>
  );
}
