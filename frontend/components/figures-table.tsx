import type { ReactNode } from 'react';

export interface FiguresRow {
  key: string | number;
  /** The row's own name: a frequency, a day, a limit. */
  label: ReactNode;
  cells: ReactNode[];
}

/**
 * A chart's text alternative: the figures it plots, as a table folded under the chart. Screen
 * readers and people who would rather read numbers get the same data the picture shows.
 */
export function FiguresTable({
  summary,
  caption,
  corner,
  columns,
  rows,
}: {
  summary: string;
  caption: string;
  /** Header of the first column (what the row labels are). */
  corner: string;
  columns: ReactNode[];
  rows: FiguresRow[];
}) {
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-patina-700">{summary}</summary>
      <div className="overflow-x-auto">
        <table className="mt-1 w-full text-right tabular-nums">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr>
              <th scope="col" className="pr-3 text-left">
                {corner}
              </th>
              {columns.map((c, i) => (
                <th key={i} scope="col" className="pr-3">
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.key}>
                <th scope="row" className="pr-3 text-left font-normal">
                  {row.label}
                </th>
                {row.cells.map((cell, i) => (
                  <td key={i} className="pr-3">
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
