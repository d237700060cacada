import {
  createColumnHelper,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type SortingState,
} from '@tanstack/react-table';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { unitLabel } from '../../../../shared/units/codes';
import { FromMemoryBadge, MagneticBadge } from '../../../components/badges';
import type { AlloySummary } from '../../../lib/api-types';
import { familyLabels, formatConductivity, formatDensity } from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';

const features = tableFeatures({ rowSortingFeature });
const helper = createColumnHelper<typeof features, AlloySummary>();

/** The API's sort string ('-conductivity') as table sorting state, and back. */
export function sortingFromParam(sort: string): SortingState {
  if (!sort || sort === 'relevance') return [];
  return [{ id: sort.replace(/^-/, ''), desc: sort.startsWith('-') }];
}

function paramFromSorting(sorting: SortingState): string {
  const first = sorting[0];
  return first ? `${first.desc ? '-' : ''}${first.id}` : '';
}

interface AlloyTableProps {
  rows: AlloySummary[];
  sort: string;
  onSortChange: (sort: string) => void;
  units: UnitPreferences;
}

/** Sorting happens on the server (the page is one slice of the whole result), so it is manual. */
export function AlloyTable({ rows, sort, onSortChange, units }: AlloyTableProps) {
  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor('name', {
          header: 'Alloy',
          cell: (info) => (
            <span className="flex flex-wrap items-center gap-1.5">
              <Link
                className="font-medium text-patina-700 underline-offset-2 hover:underline"
                to={`/alloys/${info.row.original.slug}`}
              >
                {info.getValue()}
              </Link>
              {info.row.original.fromMemory ? <FromMemoryBadge /> : null}
            </span>
          ),
        }),
        helper.accessor('uns', { header: 'UNS', cell: (info) => info.getValue() ?? '—' }),
        helper.accessor('family', {
          header: 'Family',
          cell: (info) => familyLabels[info.getValue()] ?? info.getValue(),
        }),
        helper.accessor('conductivitySPerM', {
          id: 'conductivity',
          header: `Conductivity (${unitLabel(units.conductivity)})`,
          cell: (info) =>
            formatConductivity(info.getValue(), units.conductivity).replace(/ \S+$/, ''),
        }),
        helper.accessor('densityKgPerM3', {
          id: 'density',
          header: `Density (${unitLabel(units.density)})`,
          cell: (info) => formatDensity(info.getValue(), units.density).replace(/ \S+$/, ''),
        }),
        helper.accessor('magnetic', {
          header: 'Magnetic',
          enableSorting: false,
          cell: (info) =>
            info.getValue() ? <MagneticBadge /> : <span className="text-ink/50">no</span>,
        }),
      ]),
    [units.conductivity, units.density],
  );
  const sorting = useMemo(() => sortingFromParam(sort), [sort]);
  const table = useTable({
    features,
    columns,
    data: rows,
    manualSorting: true,
    enableSortingRemoval: true,
    state: { sorting },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      onSortChange(paramFromSorting(next));
    },
  });

  return (
    <div className="overflow-x-auto rounded-md border border-patina-100 bg-white">
      {/* Below 40rem the rows become cards (styles.css, .stack-table) and the sort buttons a row. */}
      <table className="stack-table stack-table-sortable w-full border-collapse text-sm sm:min-w-[44rem]">
        <caption className="sr-only">Alloys matching the search, sortable by column</caption>
        <thead className="bg-patina-50 text-left">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const direction = header.column.getIsSorted();
                const numeric = header.id === 'conductivity' || header.id === 'density';
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={
                      direction === 'asc'
                        ? 'ascending'
                        : direction === 'desc'
                          ? 'descending'
                          : 'none'
                    }
                    className={`border-b border-patina-100 px-3 py-2 font-semibold ${numeric ? 'text-right' : ''} ${header.column.getCanSort() ? '' : 'max-sm:hidden'}`}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 hover:text-patina-700 max-sm:rounded max-sm:border max-sm:border-patina-300 max-sm:bg-white max-sm:px-2 max-sm:py-0.5 max-sm:text-xs"
                        onClick={header.column.getToggleSortingHandler()}
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="text-copper-500">
                          {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-patina-50 last:border-0 hover:bg-paper">
              {row.getAllCells().map((cell) => (
                <td
                  key={cell.id}
                  // On a phone each cell reads "label: value"; the alloy's name heads the card.
                  data-label={
                    cell.column.id === 'name' ? '' : String(cell.column.columnDef.header ?? '')
                  }
                  className={`px-3 py-2 ${cell.column.id === 'conductivity' || cell.column.id === 'density' ? 'text-right tabular-nums' : ''}`}
                >
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
