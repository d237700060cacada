import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { UnitSwitcher } from '../../../components/unit-switcher';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { useAlloyList } from '../api/list-alloys';
import { AlloyTable } from '../components/alloy-table';
import { CatalogueFiltersPanel } from '../components/catalogue-filters';
import {
  apiQueryFromFilters,
  filtersFromSearch,
  PAGE_SIZE,
  searchFromFilters,
  type CatalogueFilters,
} from '../filters';
import { rangesInUnits } from '../unit-change';
import { useDebouncedValue } from '../use-debounced-value';

/** Typing pause before the table is searched: about one request per word, not per letter. */
const SEARCH_DELAY_MS = 250;

export function CatalogueRoute() {
  const [params, setParams] = useSearchParams();
  const [units] = useUnitPreferences();
  const filters = filtersFromSearch(params);
  // Range boxes start in the display units; a shared link keeps the units it was made in.
  const withUnits: CatalogueFilters =
    filters.cmin || filters.cmax || filters.dmin || filters.dmax
      ? filters
      : { ...filters, cunit: units.conductivity, dunit: units.density };
  // The box and the URL follow each keystroke; the request waits for a pause in typing, and a
  // request overtaken by a newer one is aborted (TanStack Query's signal reaches fetch).
  const q = useDebouncedValue(filters.q, SEARCH_DELAY_MS);
  const list = useAlloyList(apiQueryFromFilters({ ...withUnits, q }));
  const updating = list.isFetching || q !== filters.q;
  const searchBox = useRef<HTMLInputElement>(null);

  const update = (next: Partial<CatalogueFilters>) => {
    const page = 'page' in next ? (next.page ?? 1) : 1;
    setParams(searchFromFilters({ ...withUnits, ...next, page }), { replace: true });
  };

  // "/" jumps to the search box from anywhere on the page, as in most search tools.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement;
      if (e.key === '/' && !['INPUT', 'SELECT', 'TEXTAREA'].includes(target.tagName)) {
        e.preventDefault();
        searchBox.current?.focus();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  const data = list.data;
  const first = data ? data.offset + 1 : 0;
  const last = data ? data.offset + data.items.length : 0;

  return (
    <section aria-labelledby="catalogue-title" className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="catalogue-title" className="text-2xl font-semibold tracking-tight">
            Catalogue
          </h1>
          <p className="text-sm text-ink/70">
            Every value cited; search by name, trade name, UNS number, family or element.
          </p>
        </div>
        <UnitSwitcher
          onChange={(next) =>
            update(
              rangesInUnits(
                withUnits,
                next.conductivity ?? withUnits.cunit,
                next.density ?? withUnits.dunit,
              ),
            )
          }
        />
      </header>

      <div className="flex flex-col gap-4 rounded-md border border-patina-100 bg-white p-4">
        <label className="flex flex-col gap-1 text-sm font-medium" htmlFor="catalogue-search">
          Search the table
          <input
            id="catalogue-search"
            ref={searchBox}
            type="search"
            autoComplete="off"
            placeholder="brass, C26000, zinc, Ni…"
            className="rounded border border-patina-300 px-3 py-2 text-base font-normal"
            value={filters.q}
            maxLength={100}
            onChange={(e) => update({ q: e.target.value })}
          />
        </label>
        <CatalogueFiltersPanel filters={withUnits} onChange={update} />
      </div>

      <div aria-live="polite" className="text-sm text-ink/70">
        {list.isError
          ? null
          : data
            ? data.total === 0
              ? null
              : `${first}–${last} of ${data.total} ${data.total === 1 ? 'alloy' : 'alloys'}${updating ? ' (updating…)' : ''}`
            : 'Loading the table…'}
      </div>

      {list.isError ? (
        <ProblemMessage error={list.error} title="The table could not be searched" />
      ) : data && data.total === 0 ? (
        <div className="rounded-md border border-dashed border-patina-300 p-6 text-center">
          <p className="font-medium">No alloy matches this search.</p>
          <p className="text-sm text-ink/70">
            Try fewer words, another spelling, or widen the ranges.
          </p>
          <button
            type="button"
            className="mt-3 rounded bg-patina-700 px-3 py-1.5 text-sm text-white hover:bg-patina-900"
            onClick={() => setParams(new URLSearchParams(), { replace: true })}
          >
            Clear the search and filters
          </button>
        </div>
      ) : data ? (
        <>
          <AlloyTable
            rows={data.items}
            sort={filters.sort}
            onSortChange={(sort) => update({ sort })}
            units={units}
          />
          <nav aria-label="Pages" className="flex items-center justify-between text-sm">
            <button
              type="button"
              className="rounded border border-patina-300 px-3 py-1 disabled:opacity-40"
              disabled={filters.page <= 1}
              onClick={() => update({ page: filters.page - 1 })}
            >
              Previous page
            </button>
            <span>
              Page {filters.page} of {Math.max(1, Math.ceil(data.total / PAGE_SIZE))}
            </span>
            <button
              type="button"
              className="rounded border border-patina-300 px-3 py-1 disabled:opacity-40"
              disabled={last >= data.total}
              onClick={() => update({ page: filters.page + 1 })}
            >
              Next page
            </button>
          </nav>
        </>
      ) : null}
      <NominalCaution />
    </section>
  );
}
