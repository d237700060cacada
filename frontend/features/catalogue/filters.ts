/**
 * The Catalogue's filters live in the URL so that a search can be shared: q, family (repeated),
 * magnetic, cmin/cmax with cunit, dmin/dmax with dunit, sort and page.
 */
export interface CatalogueFilters {
  q: string;
  family: string[];
  magnetic: '' | 'true' | 'false';
  cmin: string;
  cmax: string;
  cunit: string;
  dmin: string;
  dmax: string;
  dunit: string;
  sort: string;
  page: number;
}

export const PAGE_SIZE = 25;

export function filtersFromSearch(params: URLSearchParams): CatalogueFilters {
  const magnetic = params.get('magnetic');
  return {
    q: params.get('q') ?? '',
    family: params.getAll('family'),
    magnetic: magnetic === 'true' || magnetic === 'false' ? magnetic : '',
    cmin: params.get('cmin') ?? '',
    cmax: params.get('cmax') ?? '',
    cunit: params.get('cunit') ?? '%IACS',
    dmin: params.get('dmin') ?? '',
    dmax: params.get('dmax') ?? '',
    dunit: params.get('dunit') ?? 'g/cm3',
    sort: params.get('sort') ?? '',
    page: Math.max(1, Number.parseInt(params.get('page') ?? '1', 10) || 1),
  };
}

/** The URL form: empty fields and defaults are left out so shared links stay short. */
export function searchFromFilters(f: CatalogueFilters): URLSearchParams {
  const p = new URLSearchParams();
  if (f.q) p.set('q', f.q);
  f.family.forEach((family) => p.append('family', family));
  if (f.magnetic) p.set('magnetic', f.magnetic);
  if (f.cmin) p.set('cmin', f.cmin);
  if (f.cmax) p.set('cmax', f.cmax);
  if ((f.cmin || f.cmax) && f.cunit !== '%IACS') p.set('cunit', f.cunit);
  if (f.dmin) p.set('dmin', f.dmin);
  if (f.dmax) p.set('dmax', f.dmax);
  if ((f.dmin || f.dmax) && f.dunit !== 'g/cm3') p.set('dunit', f.dunit);
  if (f.sort) p.set('sort', f.sort);
  if (f.page > 1) p.set('page', String(f.page));
  return p;
}

/** A number typed in a filter box, or undefined while it is empty or not yet a positive number. */
function positive(text: string): number | undefined {
  const n = Number(text);
  return text.trim() !== '' && Number.isFinite(n) && n > 0 ? n : undefined;
}

/** The API query for these filters. */
export function apiQueryFromFilters(f: CatalogueFilters): URLSearchParams {
  const p = new URLSearchParams();
  if (f.q.trim()) p.set('q', f.q.trim().slice(0, 100));
  f.family.forEach((family) => p.append('family', family));
  if (f.magnetic) p.set('magnetic', f.magnetic);
  const [cmin, cmax, dmin, dmax] = [f.cmin, f.cmax, f.dmin, f.dmax].map(positive);
  if (cmin !== undefined) p.set('conductivityMin', String(cmin));
  if (cmax !== undefined) p.set('conductivityMax', String(cmax));
  if (cmin !== undefined || cmax !== undefined) p.set('conductivityUnit', f.cunit);
  if (dmin !== undefined) p.set('densityMin', String(dmin));
  if (dmax !== undefined) p.set('densityMax', String(dmax));
  if (dmin !== undefined || dmax !== undefined) p.set('densityUnit', f.dunit);
  if (f.sort) p.set('sort', f.sort);
  p.set('limit', String(PAGE_SIZE));
  p.set('offset', String((f.page - 1) * PAGE_SIZE));
  return p;
}

/** Whether a filter box holds text that is not a usable number (shown as an error, not sent). */
export function isBadNumber(text: string): boolean {
  return text.trim() !== '' && positive(text) === undefined;
}
