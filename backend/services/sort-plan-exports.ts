import { stringify } from 'csv-stringify/sync';
import { valueOf, type AlloyRecord } from '../../shared/catalogue/alloy-record';
import { percentIacs } from '../../shared/units/conductivity';
import { canonicalJson } from './releases';
import type { SortPlanAnswer } from './sort-plans';

export type ExportFormat = 'json' | 'csv' | 'c';

export interface ExportFile {
  body: string;
  contentType: string;
  filename: string;
}

const CONTENT_TYPES: Record<ExportFormat, string> = {
  json: 'application/json; charset=utf-8',
  csv: 'text/csv; charset=utf-8',
  c: 'text/x-c; charset=utf-8',
};
const EXTENSIONS: Record<ExportFormat, string> = { json: 'json', csv: 'csv', c: 'h' };

/**
 * OWASP CSV injection: a text cell a spreadsheet would run as a formula gets a leading
 * apostrophe; numbers stay numbers.
 */
function defuse(value: string | number): string | number {
  return typeof value === 'string' && /^[=+\-@\t\r\n]/.test(value) ? `'${value}` : value;
}

function csvOf(rows: Array<Record<string, string | number>>): string {
  return stringify(
    rows.map((r) => Object.fromEntries(Object.entries(r).map(([k, v]) => [k, defuse(v)]))),
    // Numbers as JavaScript writes them: the shortest text that reads back as the same double.
    { header: true, record_delimiter: '\r\n', cast: { number: (n) => String(n) } },
  );
}

/** A double as a C99 literal: JavaScript's shortest round-trip text, with a point if it has none. */
function cDouble(n: number): string {
  const s = String(n);
  return /[.e]/.test(s) ? s : `${s}.0`;
}

/**
 * A C string literal: printable ASCII as itself except `"`, `\` and `?` (which could start a
 * trigraph in C99); every other byte of the UTF-8 text as a three-digit octal escape.
 */
function cString(text: string): string {
  let out = '"';
  for (const byte of Buffer.from(text, 'utf8')) {
    const ch = String.fromCharCode(byte);
    if (byte >= 0x20 && byte < 0x7f && ch !== '"' && ch !== '\\' && ch !== '?') out += ch;
    else out += `\\${byte.toString(8).padStart(3, '0')}`;
  }
  return `${out}"`;
}

/** Lines of numbers, a few to a line, indented for the array initialisers. */
function cList(values: string[], indent: string, perLine = 4): string {
  const lines: string[] = [];
  for (let i = 0; i < values.length; i += perLine)
    lines.push(indent + values.slice(i, i + perLine).join(', '));
  return lines.join(',\n');
}

export interface SavedPlanExport {
  id: number;
  name: string;
  resultSha256: string;
  result: SortPlanAnswer;
}

/** A saved plan as a file: the same plan gives the same bytes (no clock, no locale). */
export function exportPlan(plan: SavedPlanExport, format: ExportFormat): ExportFile {
  const { release } = plan.result;
  const filename = `conductory-plan-${plan.id}-${release.version}.${EXTENSIONS[format]}`;
  const base = { contentType: CONTENT_TYPES[format], filename };
  if (format === 'json')
    return {
      ...base,
      body: `${canonicalJson({
        kind: 'conductory sort plan',
        name: plan.name,
        release,
        resultSha256: plan.resultSha256,
        result: plan.result,
      })}\n`,
    };
  if (format === 'csv')
    return {
      ...base,
      body: csvOf(
        plan.result.frequencies.flatMap((f) =>
          f.windows.map((w) => ({
            release_version: release.version,
            release_checksum: release.checksum,
            result_sha256: plan.resultSha256,
            frequency_hz: f.frequencyHz,
            product: w.product,
            low_s_per_m: w.lowSPerM,
            high_s_per_m: w.highSPerM,
            low_percent_iacs: w.lowPercentIacs,
            high_percent_iacs: w.highPercentIacs,
          })),
        ),
      ),
    };
  return { ...base, body: planHeader(plan) };
}

function planHeader(plan: SavedPlanExport): string {
  const { release, frequencies, recommendedFrequencyHz } = plan.result;
  const products = frequencies[0]?.windows.map((w) => w.product) ?? [];
  const recommended = frequencies.findIndex((f) => f.frequencyHz === recommendedFrequencyHz);
  const windows = frequencies
    .map(
      (f) =>
        `    { /* ${cDouble(f.frequencyHz)} Hz */\n${f.windows
          .map((w) => `        { ${cDouble(w.lowPercentIacs)}, ${cDouble(w.highPercentIacs)} }`)
          .join(',\n')}\n    }`,
    )
    .join(',\n');
  return `/*
 * Sort plan windows exported by Conductory.
 *
 * Table release ${release.version}, checksum (SHA-256 of the release's canonical JSON)
 * ${release.checksum}
 * Result SHA-256 ${plan.resultSha256}
 *
 * Units: frequencies in hertz; window bounds in %IACS (100 %IACS = 58.0 MS/m), the apparent
 * conductivity an instrument calibrated on solid non-magnetic blocks reports, low then high.
 * Handbook values are nominal: qualify the sorter with certified conductivity reference
 * standards, not with this table alone.
 */
#ifndef CONDUCTORY_PLAN_H
#define CONDUCTORY_PLAN_H

#define CONDUCTORY_PLAN_NAME ${cString(plan.name)}
#define CONDUCTORY_PLAN_RELEASE_VERSION ${cString(release.version)}
#define CONDUCTORY_PLAN_RELEASE_CHECKSUM ${cString(release.checksum)}
#define CONDUCTORY_PLAN_FREQUENCY_COUNT ${frequencies.length}
#define CONDUCTORY_PLAN_PRODUCT_COUNT ${products.length}
/* Index into conductory_plan_frequency_hz of the recommended frequency; -1 if none. */
#define CONDUCTORY_PLAN_RECOMMENDED_INDEX ${recommended}

/* Frequencies, Hz. */
static const double conductory_plan_frequency_hz[CONDUCTORY_PLAN_FREQUENCY_COUNT] = {
${cList(
  frequencies.map((f) => cDouble(f.frequencyHz)),
  '    ',
)}
};

/* Product names, UTF-8. */
static const char *const conductory_plan_product_name[CONDUCTORY_PLAN_PRODUCT_COUNT] = {
${cList(products.map(cString), '    ', 1)}
};

/* [frequency][product][0 = low, 1 = high], %IACS. */
static const double
    conductory_plan_window_iacs[CONDUCTORY_PLAN_FREQUENCY_COUNT][CONDUCTORY_PLAN_PRODUCT_COUNT][2] = {
${windows}
};

/*
 * The product whose window at frequency index \`frequency\` holds a reading in %IACS: its index
 * into conductory_plan_product_name, -1 when no window holds it (or the index is out of range),
 * -2 when more than one does.
 */
static inline int conductory_plan_classify(int frequency, double reading_iacs)
{
    int found = -1;
    int p;
    if (frequency < 0 || frequency >= CONDUCTORY_PLAN_FREQUENCY_COUNT)
        return -1;
    for (p = 0; p < CONDUCTORY_PLAN_PRODUCT_COUNT; p++) {
        if (reading_iacs >= conductory_plan_window_iacs[frequency][p][0] &&
            reading_iacs <= conductory_plan_window_iacs[frequency][p][1]) {
            if (found != -1)
                return -2;
            found = p;
        }
    }
    return found;
}

#endif /* CONDUCTORY_PLAN_H */
`;
}

export interface ReleaseForExport {
  version: string;
  checksum: string;
  alloys: Array<Omit<AlloyRecord, 'id'>>;
}

interface TableRow {
  slug: string;
  name: string;
  nominal: number;
  min: number;
  max: number;
  referenceTemperatureK: number;
}

function tableRows(release: ReleaseForExport): TableRow[] {
  return [...release.alloys]
    .sort((a, b) => (a.slug < b.slug ? -1 : a.slug > b.slug ? 1 : 0))
    .flatMap((a) => {
      const c = valueOf(a as AlloyRecord, 'conductivity');
      if (!c) return [];
      return [
        {
          slug: a.slug,
          name: a.name,
          nominal: c.nominal,
          min: c.min ?? c.nominal,
          max: c.max ?? c.nominal,
          referenceTemperatureK: c.referenceTemperatureK,
        },
      ];
    });
}

/** A release's conductivity table as a file, the same bytes for the same release. */
export function exportRelease(release: ReleaseForExport, format: ExportFormat): ExportFile {
  const rows = tableRows(release);
  const filename = `conductory-table-${release.version}.${EXTENSIONS[format]}`;
  const base = { contentType: CONTENT_TYPES[format], filename };
  const head = { version: release.version, checksum: release.checksum };
  if (format === 'json')
    return {
      ...base,
      body: `${canonicalJson({
        kind: 'conductory conductivity table',
        release: head,
        alloys: rows.map((r) => ({
          slug: r.slug,
          name: r.name,
          conductivity: {
            nominalSPerM: r.nominal,
            minSPerM: r.min,
            maxSPerM: r.max,
            referenceTemperatureK: r.referenceTemperatureK,
          },
        })),
      })}\n`,
    };
  if (format === 'csv')
    return {
      ...base,
      body: csvOf(
        rows.map((r) => ({
          release_version: release.version,
          release_checksum: release.checksum,
          slug: r.slug,
          name: r.name,
          conductivity_s_per_m: r.nominal,
          conductivity_min_s_per_m: r.min,
          conductivity_max_s_per_m: r.max,
          conductivity_percent_iacs: percentIacs(r.nominal),
          conductivity_min_percent_iacs: percentIacs(r.min),
          conductivity_max_percent_iacs: percentIacs(r.max),
          reference_temperature_k: r.referenceTemperatureK,
        })),
      ),
    };
  return {
    ...base,
    body: `/*
 * The conductivity table of Conductory, release ${release.version}.
 * Checksum (SHA-256 of the release's canonical JSON)
 * ${release.checksum}
 *
 * Units: conductivity in %IACS (100 %IACS = 58.0 MS/m) at each alloy's reference temperature
 * (20 °C for nearly all), nominal and the table's min–max. Handbook values are nominal: qualify a
 * sorter with certified conductivity reference standards, not with this table alone.
 */
#ifndef CONDUCTORY_TABLE_H
#define CONDUCTORY_TABLE_H

#define CONDUCTORY_TABLE_RELEASE_VERSION ${cString(release.version)}
#define CONDUCTORY_TABLE_RELEASE_CHECKSUM ${cString(release.checksum)}
#define CONDUCTORY_TABLE_ALLOY_COUNT ${rows.length}

/* Alloy slugs, as the API names them. */
static const char *const conductory_table_slug[CONDUCTORY_TABLE_ALLOY_COUNT] = {
${cList(
  rows.map((r) => cString(r.slug)),
  '    ',
  1,
)}
};

/* [alloy][0 = min, 1 = nominal, 2 = max], %IACS. */
static const double conductory_table_iacs[CONDUCTORY_TABLE_ALLOY_COUNT][3] = {
${rows
  .map(
    (r) =>
      `    { ${cDouble(percentIacs(r.min))}, ${cDouble(percentIacs(r.nominal))}, ${cDouble(percentIacs(r.max))} }`,
  )
  .join(',\n')}
};

/*
 * The first alloy at index \`start\` or after whose min–max holds a reading in %IACS, or -1.
 * Call again with the index + 1 for the next.
 */
static inline int conductory_table_find(double reading_iacs, int start)
{
    int a;
    for (a = start < 0 ? 0 : start; a < CONDUCTORY_TABLE_ALLOY_COUNT; a++) {
        if (reading_iacs >= conductory_table_iacs[a][0] &&
            reading_iacs <= conductory_table_iacs[a][2])
            return a;
    }
    return -1;
}

#endif /* CONDUCTORY_TABLE_H */
`,
  };
}
