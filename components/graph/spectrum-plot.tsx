/**
 * The spectrum on the real line against the bound of a spectral claim. Floating-point values for
 * display only: the verdict comes from the exact check, never from these numbers.
 */
export function SpectrumPlot({ spectrum, bound }: { spectrum: number[]; bound: { text: string; approx: number } | null }) {
  if (spectrum.length === 0) return null;
  const lo = Math.min(spectrum[0], bound?.approx ?? Infinity) - 0.5;
  const hi = Math.max(spectrum[spectrum.length - 1], bound?.approx ?? -Infinity) + 0.5;
  const W = 1000,
    H = 120,
    pad = 40;
  const at = (v: number) => pad + ((v - lo) / (hi - lo)) * (W - 2 * pad);
  const rho = spectrum[spectrum.length - 1];
  const stack = new Map<string, number>();
  const ticks: number[] = [];
  for (let t = Math.ceil(lo); t <= Math.floor(hi); t++) ticks.push(t);
  return (
    <figure className="rounded border border-stone-200 bg-white p-2" data-testid="spectrum-plot">
      <figcaption className="px-1 text-sm">
        Spectrum on the real line (floats, display only): largest eigenvalue ≈ <span className="font-mono">{rho.toFixed(4)}</span>
        {bound && (
          <>
            {" "}
            against the bound <span className="font-mono">{bound.text}</span> ≈ <span className="font-mono">{bound.approx.toFixed(4)}</span>
          </>
        )}
      </figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-label="eigenvalues as dots on the real line, the bound as a dashed line">
        <line x1={pad} y1={80} x2={W - pad} y2={80} stroke="#7d766a" strokeWidth={2} />
        {ticks.map((t) => (
          <g key={t}>
            <line x1={at(t)} y1={76} x2={at(t)} y2={86} stroke="#7d766a" />
            <text x={at(t)} y={104} fontSize={14} textAnchor="middle" className="font-mono" fill="#5f594f">
              {t}
            </text>
          </g>
        ))}
        {spectrum.map((v, i) => {
          const key = v.toFixed(3);
          const k = stack.get(key) ?? 0;
          stack.set(key, k + 1);
          return <circle key={i} cx={at(v)} cy={80 - 9 - k * 9} r={4} fill={i === spectrum.length - 1 ? "#1d5044" : "#5f594f"} />;
        })}
        <text x={at(rho)} y={80 - 9 - (stack.get(rho.toFixed(3)) ?? 1) * 9 - 6} fontSize={15} textAnchor="middle" className="font-mono" fill="#1d5044">
          ρ
        </text>
        {bound && (
          <g>
            <line x1={at(bound.approx)} y1={10} x2={at(bound.approx)} y2={90} stroke="#8a6a12" strokeWidth={2} strokeDasharray="6 4" />
            <text
              x={at(bound.approx) + (at(bound.approx) > W / 2 ? -6 : 6)}
              y={22}
              fontSize={14}
              textAnchor={at(bound.approx) > W / 2 ? "end" : "start"}
              className="font-mono"
              fill="#8a6a12"
            >
              bound {bound.text}
            </text>
          </g>
        )}
      </svg>
    </figure>
  );
}
