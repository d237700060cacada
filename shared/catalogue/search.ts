import Fuse from 'fuse.js';
import type { AlloyRecord } from './alloy-record';
import { elementNames } from './element-names';

/**
 * Words people use for a whole family, beside its code (common practice, no source): "brass" is
 * any copper-zinc alloy, Muntz metal and gilding metal included, though their names say "metal".
 */
export const familyWords: Readonly<Record<string, readonly string[]>> = {
  copper: ['copper', 'coppers', 'bronze', 'bronzes'],
  'copper-zinc': ['brass', 'brasses', 'copper-zinc'],
  'copper-nickel': ['copper-nickel'],
  aluminium: ['aluminium'],
  zinc: ['zinc'],
  nickel: ['nickel alloy', 'nickel alloys'],
  'iron-steel': ['iron', 'steel', 'steels'],
  precious: ['precious metal', 'precious metals'],
  other: [],
};

/**
 * Lower case, accents off, hyphens as spaces and punctuation dropped, keeping the "/" of 70/30
 * and the "." of 99.9: "Tough-pitch" and "tough pitch" are the same words.
 */
export function searchWords(text: string): string[] {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[-_\u2010-\u2015]/g, ' ')
    .replace(/[^\p{L}\p{N}/.\s]/gu, ' ')
    .split(/\s+/)
    .map((w) => w.replace(/^[./]+|[./]+$/g, ''))
    .filter(Boolean)
    .map((w) => spellings[w] ?? w);
}

/** American spellings read as the table's British ones. */
const spellings: Readonly<Record<string, string>> = {
  aluminum: 'aluminium',
  deoxidized: 'deoxidised',
  sulfur: 'sulphur',
};

/** Damerau–Levenshtein distance (adjacent swaps count one), for typos in a query word. */
export function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) =>
    Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        best = Math.min(best, d[i - 2]![j - 2]! + 1);
      }
      d[i]![j] = best;
    }
  }
  return d[a.length]![b.length]!;
}

/** A place a query word can match, and how much a match there counts. */
interface Field {
  words: string[];
  weight: number;
  /** Whether a query word may match the start of a word here (typing "cartr" finds cartridge). */
  prefix: boolean;
}

interface Entry {
  record: AlloyRecord;
  familyWords: Set<string>;
  fields: Field[];
  /** Element symbols in lower case, with mass %. */
  symbols: Map<string, number>;
  /** For the typo fallback. */
  fuzzy: {
    name: string;
    aliases: string[];
    uns: string;
    family: readonly string[];
    elements: string;
  };
}

// Weights: the alloy's own name and UNS number count most, then the names the trade uses, then
// family words, then the names of its elements ("zinc" finds every alloy with zinc in it).
const NAME = 1;
const ALIAS = 0.9;
const FAMILY = 0.6;
const ELEMENT = 0.5;
/** A query word that is only the start of a word counts this much of a whole word. */
const PREFIX = 0.8;
/** Added when the query words stand together, in order, in one field ("cartridge brass"). */
const PHRASE = 0.5;
/** Added when every query word is also a family word: "aluminium" lists the aluminium family
 * before aluminium bronze, "brass" the brasses before anything else named so. */
const IN_FAMILY = 0.2;
/** Fuzzy hits (typos) are kept only this close (Fuse score, 0 = exact) to the best one. */
const FUZZY_TAIL = 0.1;

function entryOf(record: AlloyRecord): Entry {
  const aliases = record.aliases ?? [];
  const elements = Object.keys(record.composition).map((s) => elementNames[s] ?? '');
  const family = familyWords[record.family] ?? [];
  return {
    record,
    familyWords: new Set(family.flatMap(searchWords)),
    fields: [
      { words: searchWords(record.name), weight: NAME, prefix: true },
      { words: record.uns ? [record.uns.toLowerCase()] : [], weight: NAME, prefix: true },
      ...aliases.map((a) => ({ words: searchWords(a), weight: ALIAS, prefix: true })),
      ...family.map((f) => ({ words: searchWords(f), weight: FAMILY, prefix: true })),
      ...elements.map((e) => ({ words: searchWords(e), weight: ELEMENT, prefix: true })),
      {
        words: Object.keys(record.composition).map((s) => s.toLowerCase()),
        weight: ELEMENT,
        prefix: false,
      },
    ],
    symbols: new Map(Object.entries(record.composition).map(([s, m]) => [s.toLowerCase(), m])),
    fuzzy: {
      name: record.name,
      aliases,
      uns: record.uns ?? '',
      family,
      elements: elements.join(' '),
    },
  };
}

/** How well one query word matches one word: 1 whole, PREFIX for its start, 0 not at all. */
function wordMatch(token: string, word: string, prefix: boolean): number {
  if (token === word) return 1;
  return prefix && token.length >= 2 && word.startsWith(token) ? PREFIX : 0;
}

/** Whether the query words stand in this field together and in order (the last may be a start). */
function phraseIn(tokens: string[], field: Field): boolean {
  const { words } = field;
  for (let i = 0; i + tokens.length <= words.length; i++) {
    const ok = tokens.every((t, j) =>
      j === tokens.length - 1 ? wordMatch(t, words[i + j]!, field.prefix) > 0 : t === words[i + j],
    );
    if (ok) return true;
  }
  return false;
}

/**
 * The score of an entry for these query words, or 0 when some word matches nowhere (every word
 * must match somewhere: "nickel silver" is not every alloy with nickel or silver in it).
 */
function wordScore(entry: Entry, tokens: string[]): number {
  let total = 0;
  for (const token of tokens) {
    let best = 0;
    for (const field of entry.fields) {
      for (const word of field.words) {
        best = Math.max(best, field.weight * wordMatch(token, word, field.prefix));
      }
    }
    if (best === 0) return 0;
    total += best;
  }
  let phrase = 0;
  for (const field of entry.fields) {
    if (field.weight * PHRASE > phrase && phraseIn(tokens, field)) phrase = field.weight * PHRASE;
  }
  const inFamily = tokens.every((t) => entry.familyWords.has(t)) ? IN_FAMILY : 0;
  return total / tokens.length + phrase + inFamily;
}

/**
 * Ranks the table for a search text, best first, leaving out what does not match:
 * 1. an exact UNS number or slug: that alloy alone;
 * 2. an element symbol ("Ni", "sn"): alloys containing the element, richest first; symbols match
 *    symbols, never letters inside a name ("Aluminium" does not contain nickel);
 * 3. words: each query word must match the start of a word of the name, UNS number, an alias, a
 *    family word or an element name, weighted in that order, with a bonus for the whole phrase;
 * 4. only when nothing matched so far, typos: a word found nowhere is read as the nearest word of
 *    the table one or two letters off ("catridge" → cartridge, "nikel" → nickel); failing that, a
 *    fuzzy search over the whole text, cut to the hits close to the best one.
 */
export class AlloySearch {
  private readonly entries: Entry[];
  private readonly fuse: Fuse<Entry>;
  /** Every word of the names, UNS numbers, aliases, family words and element names. */
  private readonly vocabulary: string[];

  constructor(records: AlloyRecord[]) {
    this.entries = records.map(entryOf);
    this.vocabulary = [
      ...new Set(
        this.entries.flatMap((e) => e.fields.filter((f) => f.prefix).flatMap((f) => f.words)),
      ),
    ];
    this.fuse = new Fuse(this.entries, {
      keys: [
        { name: 'fuzzy.name', weight: 3 },
        { name: 'fuzzy.aliases', weight: 3 },
        { name: 'fuzzy.uns', weight: 2 },
        { name: 'fuzzy.family', weight: 1 },
        { name: 'fuzzy.elements', weight: 1 },
      ],
      threshold: 0.35,
      ignoreLocation: true,
      includeScore: true,
    });
  }

  search(text: string): AlloyRecord[] {
    let tokens = searchWords(text);
    // "UNS C26000" is C26000.
    if (tokens.length > 1 && tokens[0] === 'uns') tokens = tokens.slice(1);
    if (tokens.length === 0) return [];

    const compact = tokens.join('');
    const exact = this.entries.filter(
      (e) => e.record.uns?.toLowerCase() === compact || e.record.slug === tokens.join('-'),
    );
    if (exact.length) return exact.map((e) => e.record);

    const ranked = this.rank(tokens);
    if (ranked.length) return ranked;
    const corrected = tokens.map((t) => this.nearestWord(t));
    if (corrected.some((t, i) => t !== tokens[i])) {
      const again = this.rank(corrected);
      if (again.length) return again;
    }

    const hits = this.fuse.search(tokens.join(' '));
    const best = hits[0]?.score ?? 0;
    return hits.filter((h) => (h.score ?? 0) <= best + FUZZY_TAIL).map((h) => h.item.record);
  }

  /** Steps 2 and 3: element symbol, then words. */
  private rank(tokens: string[]): AlloyRecord[] {
    const ranked: Entry[] = [];
    if (tokens.length === 1 && /^[a-z]{1,2}$/.test(tokens[0]!)) {
      const symbol = tokens[0]!;
      ranked.push(
        ...this.entries
          .filter((e) => e.symbols.has(symbol))
          .sort((a, b) => b.symbols.get(symbol)! - a.symbols.get(symbol)!),
      );
    }
    const seen = new Set(ranked);
    const byWords = this.entries
      .map((entry, order) => ({ entry, order, score: wordScore(entry, tokens) }))
      .filter((s) => s.score > 0 && !seen.has(s.entry))
      .sort((a, b) => b.score - a.score || a.order - b.order)
      .map((s) => s.entry);
    return [...ranked, ...byWords].map((e) => e.record);
  }

  /**
   * The word itself when the table knows it (or a word starting with it); otherwise the nearest
   * known word at most one letter off (two for words of seven letters or more), if exactly one
   * word is nearest.
   */
  private nearestWord(token: string): string {
    if (token.length < 4 || this.vocabulary.some((w) => w.startsWith(token))) return token;
    const allowed = token.length >= 7 ? 2 : 1;
    let best = token;
    let bestDistance = allowed + 1;
    let tie = false;
    for (const word of this.vocabulary) {
      if (Math.abs(word.length - token.length) > allowed) continue;
      const d = editDistance(token, word);
      if (d < bestDistance) [best, bestDistance, tie] = [word, d, false];
      else if (d === bestDistance && word !== best) tie = true;
    }
    return bestDistance <= allowed && !tie ? best : token;
  }
}
