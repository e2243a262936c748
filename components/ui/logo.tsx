/** Cairn's mark: three stones stacked off-centre, the top one in the accent colour. */
export function LogoMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <ellipse cx="16" cy="26" rx="12" ry="4.2" fill="#5f594f" />
      <ellipse cx="14.5" cy="18.6" rx="8.6" ry="3.8" fill="#7d766a" />
      <ellipse cx="17" cy="11.6" rx="5.6" ry="3.3" fill="#a29b8c" />
      <ellipse cx="15.6" cy="5.6" rx="3.2" ry="2.5" fill="#2f7d6b" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2 text-stone-900">
      <LogoMark />
      <span className="text-xl font-semibold tracking-wide">Cairn</span>
    </span>
  );
}
