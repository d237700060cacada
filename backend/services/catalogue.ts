import { restsOnMemory, valueOf, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { AlloySearch } from '../../shared/catalogue/search';
import type { AlloyScoring } from '../../shared/match/score';
import { isResistivityUnit, percentIacs, toSiemensPerMetre } from '../../shared/units/conductivity';
import { toKilogramsPerCubicMetre } from '../../shared/units/density';
import type { PreparedJson } from '../http/send-prepared-json';
import { prepareMatch } from './match';

export type SortKey = 'relevance' | 'name' | 'uns' | 'family' | 'conductivity' | 'density';

export interface CatalogueQuery {
  q?: string;
  family?: string[];
  magnetic?: boolean;
  conductivityMin?: number;
  conductivityMax?: number;
  conductivityUnit?: string;
  densityMin?: number;
  densityMax?: number;
  densityUnit?: string;
  sort?: string;
  limit: number;
  offset: number;
}

export interface CatalogueItem {
  slug: string;
  name: string;
  uns: string | null;
  family: string;
  magnetic: boolean;
  relativePermeability: number;
  conductivitySPerM: number;
  conductivityPercentIacs: number;
  densityKgPerM3: number;
  fromMemory: boolean;
}

export interface CataloguePage {
  items: CatalogueItem[];
  total: number;
  limit: number;
  offset: number;
}

/** A search's answer as the API sends it: the page, and its JSON bytes made once. */
export interface SearchAnswer extends PreparedJson {
  page: CataloguePage;
}

interface Indexed {
  record: AlloyRecord;
  item: CatalogueItem;
}

function toItem(record: AlloyRecord): CatalogueItem {
  const conductivity = valueOf(record, 'conductivity')?.nominal ?? NaN;
  return {
    slug: record.slug,
    name: record.name,
    uns: record.uns,
    family: record.family,
    magnetic: record.magnetic,
    relativePermeability: record.relativePermeability,
    conductivitySPerM: conductivity,
    conductivityPercentIacs: percentIacs(conductivity),
    densityKgPerM3: valueOf(record, 'density')?.nominal ?? NaN,
    fromMemory: restsOnMemory(record),
  };
}

const compareBy: Record<
  Exclude<SortKey, 'relevance'>,
  (a: CatalogueItem, b: CatalogueItem) => number
> = {
  name: (a, b) => a.name.localeCompare(b.name),
  uns: (a, b) => (a.uns ?? '\uffff').localeCompare(b.uns ?? '\uffff'),
  family: (a, b) => a.family.localeCompare(b.family) || a.name.localeCompare(b.name),
  conductivity: (a, b) => a.conductivitySPerM - b.conductivitySPerM,
  density: (a, b) => a.densityKgPerM3 - b.densityKgPerM3,
};

/**
 * The searchable catalogue: the published table held in memory (a few hundred rows at most) with a
 * search index over UNS numbers, element symbols, names, aliases, family words and element names
 * (shared/catalogue/search.ts says how it ranks). Rebuilt when the table changes.
 */
export class Catalogue {
  private readonly entries: Indexed[];
  private readonly bySlug: Map<string, Indexed>;
  private readonly index: AlloySearch;
  /** Hits per search text: the table is immutable for this object's life, so they never go stale. */
  private readonly hitCache = new Map<string, CatalogueItem[]>();
  private prepared: AlloyScoring[] | undefined;
  /** Answers per query (its parsed form), newest last; the table never changes under them. */
  private readonly answers = new Map<string, SearchAnswer>();

  constructor(records: AlloyRecord[]) {
    this.entries = records.map((record) => ({ record, item: toItem(record) }));
    this.bySlug = new Map(this.entries.map((e) => [e.record.slug, e]));
    this.index = new AlloySearch(records);
  }

  get size(): number {
    return this.entries.length;
  }

  /** The alloy and its catalogue summary, or undefined for an unknown slug. */
  find(slug: string): { record: AlloyRecord; item: CatalogueItem } | undefined {
    return this.bySlug.get(slug);
  }

  all(): AlloyRecord[] {
    return this.entries.map((e) => e.record);
  }

  /** The table prepared for Match (services/match.ts), once for this table's life. */
  matchTable(): AlloyScoring[] {
    return (this.prepared ??= prepareMatch(this.all()));
  }

  private hits(text: string): CatalogueItem[] {
    const key = text.toLowerCase();
    let hits = this.hitCache.get(key);
    if (!hits) {
      hits = this.index.search(text).map((record) => this.bySlug.get(record.slug)!.item);
      if (this.hitCache.size >= HIT_CACHE_SIZE)
        this.hitCache.delete(this.hitCache.keys().next().value!);
      this.hitCache.set(key, hits);
    }
    return hits;
  }

  /**
   * {@link search}'s answer with its JSON bytes, kept for the last few hundred queries: a
   * sorting line's operators repeat the same searches, and turning a page into JSON cost more than
   * finding it (issue 13's profile).
   */
  searchAnswer(query: CatalogueQuery): SearchAnswer {
    const key = JSON.stringify(query);
    let answer = this.answers.get(key);
    if (answer) {
      // Most recently used last, so the oldest is the one dropped.
      this.answers.delete(key);
    } else {
      const page = this.search(query);
      answer = { page, bytes: Buffer.from(JSON.stringify(page)) };
      if (this.answers.size >= ANSWER_CACHE_SIZE)
        this.answers.delete(this.answers.keys().next().value!);
    }
    this.answers.set(key, answer);
    return answer;
  }

  search(query: CatalogueQuery): CataloguePage {
    const text = query.q?.trim() ?? '';
    let items = text ? this.hits(text) : this.entries.map((e) => e.item);
    items = items.filter((item) => matchesFilters(item, query));
    const sort = query.sort ?? (text ? 'relevance' : 'name');
    const descending = sort.startsWith('-');
    const key = (descending ? sort.slice(1) : sort) as SortKey;
    if (key !== 'relevance') {
      const compare = compareBy[key];
      items = [...items].sort((a, b) => (descending ? compare(b, a) : compare(a, b)));
    } else if (descending) {
      items = [...items].reverse();
    }
    return {
      items: items.slice(query.offset, query.offset + query.limit),
      total: items.length,
      limit: query.limit,
      offset: query.offset,
    };
  }
}

/** Most searches repeat (a sorter's operators type the same few names); keep the last few hundred. */
const HIT_CACHE_SIZE = 256;
/** Kept answers: a page is a few kB, so a few MB at most. */
const ANSWER_CACHE_SIZE = 256;

/** Range filters in the unit the caller gave; a resistivity range turns around in conductivity. */
function matchesFilters(item: CatalogueItem, query: CatalogueQuery): boolean {
  if (query.family?.length && !query.family.includes(item.family)) return false;
  if (query.magnetic !== undefined && item.magnetic !== query.magnetic) return false;
  const cUnit = query.conductivityUnit ?? '%IACS';
  const bounds = [query.conductivityMin, query.conductivityMax].map((v) =>
    v === undefined ? undefined : toSiemensPerMetre(v, cUnit),
  );
  const [cLow, cHigh] = isResistivityUnit(cUnit) ? [bounds[1], bounds[0]] : bounds;
  if (cLow !== undefined && item.conductivitySPerM < cLow) return false;
  if (cHigh !== undefined && item.conductivitySPerM > cHigh) return false;
  const dUnit = query.densityUnit ?? 'g/cm3';
  if (
    query.densityMin !== undefined &&
    item.densityKgPerM3 < toKilogramsPerCubicMetre(query.densityMin, dUnit)
  )
    return false;
  if (
    query.densityMax !== undefined &&
    item.densityKgPerM3 > toKilogramsPerCubicMetre(query.densityMax, dUnit)
  )
    return false;
  return true;
}
