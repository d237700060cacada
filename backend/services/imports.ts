import { parse } from 'csv-parse/sync';
import { toSiemensPerMetre } from '../../shared/units/conductivity';
import { ProblemError } from '../http/problem';
import type { Catalogue } from './catalogue';
import type { ImportSet, MeasurementRow, RevisionSet } from './curation';
import { valueProblems } from './curation';

/** Rows past this are refused whole: a measurement file of a day's work is a few hundred. */
export const MAX_IMPORT_ROWS = 5000;

export const IMPORT_COLUMNS = {
  alloys: [
    'slug',
    'name',
    'family',
    'uns',
    'conductivity_iacs',
    'conductivity_min_iacs',
    'conductivity_max_iacs',
    'density_g_cm3',
    'notes',
  ],
  measurements: [
    'slug',
    'conductivity_ms_m',
    'frequency_khz',
    'temperature_c',
    'uncertainty_percent',
    'sample',
    'instrument',
  ],
} as const;
const REQUIRED = {
  alloys: ['slug', 'conductivity_iacs', 'density_g_cm3'],
  measurements: [
    'slug',
    'conductivity_ms_m',
    'frequency_khz',
    'temperature_c',
    'uncertainty_percent',
  ],
};
const FAMILIES = [
  'copper',
  'copper-zinc',
  'copper-nickel',
  'aluminium',
  'zinc',
  'nickel',
  'iron-steel',
  'precious',
  'other',
];

export interface RowError {
  row: number;
  field: string;
  message: string;
}

export interface ImportPreview {
  kind: 'alloys' | 'measurements';
  rows: number;
  errors: RowError[];
  changes: Array<{
    row: number;
    alloy: string;
    action: 'create' | 'edit' | 'add measurement';
    summary: string;
  }>;
  set: ImportSet | null;
}

/** Templates a curator downloads and fills in. */
export function importTemplate(kind: 'alloys' | 'measurements'): string {
  const example =
    kind === 'alloys'
      ? 'cartridge-brass-c26000,Cartridge brass 70/30,copper-zinc,C26000,28.0,27.0,29.0,8.53,annealed strip'
      : 'cartridge-brass-c26000,16.1,60,21.5,1.5,strip offcut 1 mm,eddy-current conductivity meter, 12 mm probe';
  return `${IMPORT_COLUMNS[kind].join(',')}\r\n${kind === 'measurements' ? example.replace('eddy-current conductivity meter, 12 mm probe', '"eddy-current conductivity meter, 12 mm probe"') : example}\r\n`;
}

/** The file's text, refusing what is not text: NUL bytes or invalid UTF-8 mean a binary upload. */
function textOf(buffer: Buffer): string {
  if (buffer.includes(0))
    throw new ProblemError(
      415,
      'Unsupported media type',
      'The file is binary, not CSV or JSON text.',
    );
  const text = new TextDecoder('utf-8', { fatal: false }).decode(buffer);
  if (text.includes('\uFFFD'))
    throw new ProblemError(415, 'Unsupported media type', 'The file is not UTF-8 text.');
  return text.replace(/^\uFEFF/, ''); // a byte-order mark from a spreadsheet export is fine
}

function records(text: string): Array<Record<string, unknown>> {
  const trimmed = text.trimStart();
  if (trimmed.startsWith('[') || trimmed.startsWith('{')) {
    let data: unknown;
    try {
      data = JSON.parse(trimmed);
    } catch (error) {
      throw new ProblemError(
        400,
        'Bad request',
        `The JSON file does not parse: ${(error as Error).message}`,
      );
    }
    if (
      !Array.isArray(data) ||
      data.some((r) => typeof r !== 'object' || r === null || Array.isArray(r))
    ) {
      throw new ProblemError(
        400,
        'Bad request',
        'A JSON import is an array of objects, one per row.',
      );
    }
    return data as Array<Record<string, unknown>>;
  }
  try {
    return parse(text, {
      columns: (header: string[]) => header.map((h) => h.trim().toLowerCase()),
      skip_empty_lines: true,
      trim: true,
      relax_column_count: false,
      max_record_size: 10_000,
    });
  } catch (error) {
    throw new ProblemError(
      400,
      'Bad request',
      `The CSV file does not parse: ${(error as Error).message}`,
    );
  }
}

const num = (v: unknown) =>
  v === undefined || v === null || String(v).trim() === ''
    ? undefined
    : Number(String(v).replace(',', '.'));

/**
 * Reads an upload and checks every row; returns what would change, or every row error. Nothing
 * is written here: applying is a separate step, reviewed like any other change.
 */
export function previewImport(buffer: Buffer, catalogue: Catalogue): ImportPreview {
  return previewRecords(records(textOf(buffer)), catalogue);
}

/** The same checks on records already parsed (the streaming upload path). */
export function previewRecords(
  rows: Array<Record<string, unknown>>,
  catalogue: Catalogue,
): ImportPreview {
  if (rows.length === 0) throw new ProblemError(400, 'Bad request', 'The file has no rows.');
  if (rows.length > MAX_IMPORT_ROWS)
    throw new ProblemError(
      413,
      'Request body too large',
      `At most ${MAX_IMPORT_ROWS} rows per import; this file has ${rows.length}.`,
    );
  const columns = Object.keys(rows[0]!).map((c) => c.toLowerCase());
  const kind = columns.includes('conductivity_ms_m') ? 'measurements' : 'alloys';
  const known = IMPORT_COLUMNS[kind] as readonly string[];
  const unknown = columns.filter((c) => !known.includes(c));
  const missing = REQUIRED[kind].filter((c) => !columns.includes(c));
  if (unknown.length || missing.length) {
    throw new ProblemError(
      400,
      'Bad request',
      `Wrong columns for a${kind === 'alloys' ? 'n alloy' : ' measurement'} import.${unknown.length ? ` Unknown: ${unknown.join(', ')}.` : ''}${missing.length ? ` Missing: ${missing.join(', ')}.` : ''} Expected: ${known.join(', ')}.`,
    );
  }
  const errors: RowError[] = [];
  const changes: ImportPreview['changes'] = [];
  const alloyRows: Array<{ alloy: string; set: RevisionSet }> = [];
  const measurementRows: MeasurementRow[] = [];
  rows.forEach((raw, index) => {
    const r = Object.fromEntries(Object.entries(raw).map(([k, v]) => [k.toLowerCase(), v]));
    const row = index + 2; // line number in the file: the header is line 1
    const rowErrors: RowError[] = [];
    const bad = (field: string, message: string) => rowErrors.push({ row, field, message });
    const slug = String(r.slug ?? '').trim();
    const existing = slug ? catalogue.find(slug) : undefined;
    if (!/^[a-z0-9][a-z0-9-]{0,79}$/.test(slug))
      bad('slug', 'lower-case letters, digits and hyphens');
    if (kind === 'alloys') {
      const iacs = num(r.conductivity_iacs);
      const lo = num(r.conductivity_min_iacs);
      const hi = num(r.conductivity_max_iacs);
      const density = num(r.density_g_cm3);
      if (iacs === undefined || !Number.isFinite(iacs) || iacs <= 0 || iacs > 120)
        bad('conductivity_iacs', 'a number from 0 to 120 %IACS');
      if (density === undefined || !Number.isFinite(density) || density <= 0 || density > 25)
        bad('density_g_cm3', 'a number from 0 to 25 g/cm³');
      const name = String(r.name ?? '').trim();
      const family = String(r.family ?? '').trim();
      if (!existing && !name) bad('name', 'a new alloy needs a name');
      if (family && !FAMILIES.includes(family)) bad('family', `one of ${FAMILIES.join(', ')}`);
      if (!existing && !family) bad('family', 'a new alloy needs a family');
      if (rowErrors.length === 0) {
        const toS = (p: number | undefined) =>
          p === undefined ? null : toSiemensPerMetre(p, '%IACS');
        const set: RevisionSet = {
          ...(name ? { name } : {}),
          ...(family ? { family } : {}),
          ...(r.uns ? { uns: String(r.uns).trim() } : {}),
          ...(r.notes ? { notes: String(r.notes) } : {}),
          values: {
            conductivity: { nominal: toS(iacs)!, min: toS(lo), max: toS(hi) },
            density: { nominal: density! * 1000 },
          },
        };
        for (const p of valueProblems(set.values, 'values'))
          bad(
            p.path.includes('min')
              ? 'conductivity_min_iacs'
              : p.path.includes('max')
                ? 'conductivity_max_iacs'
                : 'conductivity_iacs',
            p.message,
          );
        if (rowErrors.length === 0) {
          alloyRows.push({ alloy: slug, set });
          changes.push({
            row,
            alloy: slug,
            action: existing ? 'edit' : 'create',
            summary: `${iacs} %IACS, ${density} g/cm³`,
          });
        }
      }
    } else {
      const ms = num(r.conductivity_ms_m);
      const khz = num(r.frequency_khz);
      const c = num(r.temperature_c);
      const u = num(r.uncertainty_percent);
      if (slug && !existing) bad('slug', `no alloy '${slug}' in the table`);
      if (ms === undefined || !(ms > 0) || ms > 120)
        bad('conductivity_ms_m', 'a number from 0 to 120 MS/m');
      if (khz === undefined || !(khz > 0) || khz > 100_000)
        bad('frequency_khz', 'a positive frequency in kHz');
      if (c === undefined || !Number.isFinite(c) || c < -100 || c > 500)
        bad('temperature_c', 'a temperature from −100 to 500 °C');
      if (u === undefined || !(u > 0) || u > 50) bad('uncertainty_percent', 'from 0 to 50 %');
      const sample = String(r.sample ?? '').trim();
      const instrument = String(r.instrument ?? '').trim();
      if (!sample) bad('sample', 'describe the sample');
      if (!instrument) bad('instrument', 'describe the instrument');
      if (rowErrors.length === 0) {
        measurementRows.push({
          alloy: slug,
          conductivitySPerM: ms! * 1e6,
          frequencyHz: khz! * 1e3,
          temperatureK: c! + 273.15,
          uncertaintyPercent: u!,
          sample,
          instrument,
        });
        changes.push({
          row,
          alloy: slug,
          action: 'add measurement',
          summary: `${ms} MS/m at ${khz} kHz, ${c} °C`,
        });
      }
    }
    errors.push(...rowErrors);
  });
  return {
    kind,
    rows: rows.length,
    errors,
    changes,
    set: errors.length
      ? null
      : kind === 'alloys'
        ? { kind, rows: alloyRows }
        : { kind, rows: measurementRows },
  };
}
