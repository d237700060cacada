import { useLayoutEffect, useRef, type CSSProperties, type ReactNode } from 'react';

/** A column header; a hidden one (e.g. over a column of buttons) is read out but not shown. */
export type DataTableHeader = string | { label: string; visuallyHidden: true };

const headerLabel = (h: DataTableHeader) => (typeof h === 'string' ? h : h.label);

/**
 * Gives every body cell the label of its column (data-label), which styles.css shows before the
 * value when the table becomes a stack of cards on a phone. Done on the rendered rows, so callers
 * keep writing plain <tr>/<td>; cells spanning several columns and cells under a hidden header
 * get none.
 */
function labelCells(table: HTMLTableElement, labels: string[]) {
  for (const row of Array.from(table.tBodies).flatMap((b) => Array.from(b.rows))) {
    let column = 0;
    for (const cell of Array.from(row.cells)) {
      // A cell across several columns (a "nothing yet" line) speaks for itself.
      if (cell.tagName === 'TD')
        cell.dataset.label = cell.colSpan > 1 ? '' : (labels[column] ?? '');
      column += cell.colSpan || 1;
    }
  }
}

/**
 * The table frame the list screens share: a white panel, a caption for screen readers and a
 * header row; the rows are the caller's. From 40rem up it is a table (scrolling sideways when
 * narrower than minWidth); below, each row is a card of "label: value" lines, so a phone shows
 * every column without scrolling.
 */
export function DataTable({
  caption,
  headers,
  minWidth = '40rem',
  children,
}: {
  caption: string;
  headers: DataTableHeader[];
  minWidth?: string;
  children: ReactNode;
}) {
  const ref = useRef<HTMLTableElement>(null);
  const labels = headers.map((h) => (typeof h === 'string' ? h : ''));
  const key = labels.join('\u0000');
  useLayoutEffect(() => {
    const table = ref.current;
    if (!table) return;
    const names = key.split('\u0000');
    labelCells(table, names);
    // Rows a child component adds or replaces on its own are labelled too.
    const observer = new MutationObserver(() => labelCells(table, names));
    observer.observe(table, { childList: true, subtree: true });
    return () => observer.disconnect();
  }, [key]);
  return (
    <div className="overflow-x-auto rounded-md border border-patina-100 bg-white">
      <table
        ref={ref}
        className="stack-table w-full text-sm sm:min-w-(--table-min-width)"
        style={{ '--table-min-width': minWidth } as CSSProperties}
      >
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-patina-50 text-left">
          <tr>
            {headers.map((h, i) => (
              <th key={`${headerLabel(h)}-${i}`} scope="col" className="px-3 py-2">
                {typeof h === 'string' ? h : <span className="sr-only">{h.label}</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
