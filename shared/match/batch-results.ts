/**
 * The lines of a batch Match answer and their CSV form. The API writes them (text/csv or
 * application/x-ndjson) and the Match screen turns the NDJSON it read back into the same CSV for
 * its download, so the columns are defined once, here.
 */

/** Candidates per reading in a batch answer. */
export const BATCH_CANDIDATES = 3;

export interface BatchCandidate {
  slug: string;
  name: string;
  uns: string | null;
  /** The fit of POST /match (0..1, four decimals): it ranks, it is no probability. */
  score: number;
}

/** A reading of the file in SI: S/m, K, kg/m³, Hz; the uncertainty in percent. */
export interface BatchReading {
  conductivitySPerM: number;
  temperatureK: number;
  densityKgPerM3: number | null;
  frequencyHz: number | null;
  uncertaintyPercent: number;
}

/**
 * One line of the answer per reading, in file order. `row` is the line of the file the reading
 * ends on (the header is line 1). `none`: no alloy of the table fits the reading.
 */
export type BatchLine =
  | {
      row: number;
      id: string | null;
      status: 'matched' | 'none';
      reading: BatchReading;
      candidates: BatchCandidate[];
    }
  | { row: number; id: string | null; status: 'error'; error: string };

/** The columns both batch answers open with: the row, its status and the reading as read. */
const READING_CSV_COLUMNS = [
  'row',
  'id',
  'status',
  'error',
  'conductivity_s_per_m',
  'conductivity_percent_iacs',
  'temperature_k',
  'density_kg_per_m3',
  'frequency_hz',
] as const;

export const BATCH_CSV_COLUMNS: readonly string[] = [
  ...READING_CSV_COLUMNS,
  ...Array.from({ length: BATCH_CANDIDATES }, (_, i) =>
    ['slug', 'name', 'uns', 'score'].map((f) => `candidate_${i + 1}_${f}`),
  ).flat(),
];

/**
 * One CSV cell (RFC 4180): quoted when it holds a comma, quote or line break. Text a spreadsheet
 * would run as a formula (= + - @ tab CR LF first) gets a leading apostrophe (OWASP CSV
 * injection); numbers stay numbers.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = /^[=+\-@\t\r\n]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The header line, CRLF-terminated. */
export function batchCsvHeader(): string {
  return `${BATCH_CSV_COLUMNS.join(',')}\r\n`;
}

/** %IACS of a conductivity in S/m (100 %IACS = 58.0 MS/m, IEC 60028), to five significant figures. */
const iacs = (sPerM: number) => Number(((sPerM / 58.0e6) * 100).toPrecision(5));

/** One answer line as a CSV record, CRLF-terminated. */
export function batchCsvRecord(line: BatchLine): string {
  const cells: Array<string | number | null> = [line.row, line.id, line.status];
  if (line.status === 'error') {
    cells.push(line.error, null, null, null, null, null);
    for (let i = 0; i < BATCH_CANDIDATES; i++) cells.push(null, null, null, null);
  } else {
    const r = line.reading;
    cells.push(
      null,
      r.conductivitySPerM,
      iacs(r.conductivitySPerM),
      r.temperatureK,
      r.densityKgPerM3,
      r.frequencyHz,
    );
    for (let i = 0; i < BATCH_CANDIDATES; i++) {
      const c = line.candidates[i];
      cells.push(c?.slug ?? null, c?.name ?? null, c?.uns ?? null, c?.score ?? null);
    }
  }
  return `${cells.map(csvCell).join(',')}\r\n`;
}

/**
 * Where the frequency a reading was classified at came from: the plan's frequency nearest the
 * reading's own (in log terms), the plan's recommended one (the reading gives none), or the
 * plan's lowest (the reading gives none and the plan recommends none: a one-product plan).
 */
export type PlanFrequencySource = 'reading' | 'recommended' | 'lowest';

/**
 * One line of an answer classified by a saved sort plan. `product`: the one window holding the
 * reading; `none`: no window holds it; `ambiguous`: several do (`products` names them all, in
 * the plan's order). `notes` are per-row remarks that do not stop the classification (a
 * temperature outside the plan's range).
 */
export type BatchPlanLine =
  | {
      row: number;
      id: string | null;
      status: 'product' | 'none' | 'ambiguous';
      reading: BatchReading;
      planFrequencyHz: number;
      frequencyFrom: PlanFrequencySource;
      product: string | null;
      products: string[];
      notes: string[];
    }
  | { row: number; id: string | null; status: 'error'; error: string };

export const BATCH_PLAN_CSV_COLUMNS: readonly string[] = [
  ...READING_CSV_COLUMNS,
  'plan_frequency_hz',
  'frequency_from',
  'product',
  'products',
  'notes',
];

/** The header line of a plan-classified answer, CRLF-terminated. */
export function batchPlanCsvHeader(): string {
  return `${BATCH_PLAN_CSV_COLUMNS.join(',')}\r\n`;
}

/**
 * One plan-classified line as a CSV record, CRLF-terminated. `products` and `notes` join their
 * items with "; " (product names are the plan author's own text, so a name holding "; " reads
 * ambiguously there: the NDJSON answer keeps them apart).
 */
export function batchPlanCsvRecord(line: BatchPlanLine): string {
  const cells: Array<string | number | null> = [line.row, line.id, line.status];
  if (line.status === 'error') cells.push(line.error, ...Array<null>(10).fill(null));
  else {
    const r = line.reading;
    cells.push(
      null,
      r.conductivitySPerM,
      iacs(r.conductivitySPerM),
      r.temperatureK,
      r.densityKgPerM3,
      r.frequencyHz,
      line.planFrequencyHz,
      line.frequencyFrom,
      line.product,
      line.products.join('; '),
      line.notes.join('; '),
    );
  }
  return `${cells.map(csvCell).join(',')}\r\n`;
}

/** A plan-classified line that is a reading's classification, not a bad row. */
export type BatchPlanClassified = Exclude<BatchPlanLine, { status: 'error' }>;
