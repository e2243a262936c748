/**
 * A wide table scrolls sideways inside this frame, never the page. The frame is a labelled region that can
 * take focus, so keyboard users can scroll it too.
 */
export function TableScroll({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="table-scroll max-w-full overflow-x-auto" role="region" aria-label={label} tabIndex={0}>
      {children}
    </div>
  );
}
