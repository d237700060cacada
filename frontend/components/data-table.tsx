import type { ReactNode } from 'react';

/**
 * The table frame the list screens share: a scrolling white panel, a caption for screen readers
 * and a header row; the rows are the caller's.
 */
export function DataTable({
  caption,
  headers,
  minWidth = '40rem',
  children,
}: {
  caption: string;
  headers: string[];
  minWidth?: string;
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto rounded-md border border-patina-100 bg-white">
      <table className="w-full text-sm" style={{ minWidth }}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-patina-50 text-left">
          <tr>
            {headers.map((h, i) => (
              <th key={`${h}-${i}`} scope="col" className="px-3 py-2">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
