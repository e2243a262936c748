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

/**
 * A table with one header row inside a TableScroll (labelled by `label`); its rows are the children. `headerClassName`
 * styles the header row, `cellClassName` every header cell.
 */
export function ScrollTable({
  label,
  headers,
  className = "w-full text-sm",
  headerClassName = "text-left",
  cellClassName,
  testId,
  children,
}: {
  label: string;
  headers: React.ReactNode[];
  className?: string;
  headerClassName?: string;
  cellClassName?: string;
  testId?: string;
  children: React.ReactNode;
}) {
  return (
    <TableScroll label={label}>
      <table className={className} data-testid={testId}>
        <thead>
          <tr className={headerClassName}>
            {headers.map((h, i) => (
              <th key={i} className={cellClassName}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </TableScroll>
  );
}
