import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import { batchCsvRecord, csvCell } from '../../shared/match/batch-results';
import { createAlloyRepository } from '../../backend/db/alloy-repository';
import { matchReading } from '../../backend/services/match';
import {
  createBatchMatcher,
  parseBatchHeader,
  parseBatchRow,
} from '../../backend/services/match-batch';
import { createTestDatabase } from '../helpers/test-app';

let knex: Knex;
let alloys: AlloyRecord[];
beforeAll(async () => {
  knex = await createTestDatabase();
  alloys = await createAlloyRepository(knex).listPublished();
});
afterAll(() => knex.destroy());

describe('the batch ranks as POST /match ranks', () => {
  it('the same three candidates with the same scores over a grid of readings', () => {
    // The check value is matchReading itself (POST /match's service, with its reasons in words):
    // the batch's arithmetic-only path must agree with it everywhere, not only near the table.
    const rank = createBatchMatcher(alloys);
    let compared = 0;
    for (let iacs = 1; iacs <= 105; iacs += 1.7)
      for (const celsius of [-50, -10, 20, 20.04, 35, 90, 200])
        for (const density of [undefined, 2700, 6600, 7900, 8500, 8900, 10500])
          for (const uncertaintyPercent of [0.5, 2, 10]) {
            const reading = {
              conductivitySPerM: iacs * 0.58e6,
              temperatureK: celsius + 273.15,
              densityKgPerM3: density,
              uncertaintyPercent,
            };
            const expected = matchReading(alloys, reading, 3).map((c) => [c.slug, c.score]);
            const actual = rank(reading).map((c) => [c.slug, c.score]);
            expect(actual, JSON.stringify(reading)).toEqual(expected);
            compared++;
          }
    expect(compared).toBeGreaterThan(5000);
  });
});

describe('the header', () => {
  it('takes units in brackets or in unit columns, names in any case and spacing', () => {
    const a = parseBatchHeader(['ID', 'Conductivity [MS/m]', ' Temperature (°C) ']);
    expect(a.electrical).toMatchObject({ index: 1, unit: 'MS/m', unitIndex: null });
    expect(a.temperature).toMatchObject({ index: 2, unit: 'C' });
    const b = parseBatchHeader([
      'resistivity',
      'Resistivity Unit',
      'temperature',
      'temperature_unit',
    ]);
    expect(b.electrical).toMatchObject({ name: 'resistivity', unit: null, unitIndex: 1 });
  });
  it('refuses a repeated column, both conductivity and resistivity, a unit twice', () => {
    expect(() => parseBatchHeader(['id', 'id', 'conductivity (%IACS)', 'temperature (C)'])).toThrow(
      /appears twice/,
    );
    expect(() =>
      parseBatchHeader(['conductivity (%IACS)', 'resistivity (uohm_cm)', 'temperature (C)']),
    ).toThrow(/not both/);
    expect(() =>
      parseBatchHeader(['conductivity (%IACS)', 'conductivity_unit', 'temperature (C)']),
    ).toThrow(/keep one/);
    expect(() => parseBatchHeader(['resistivity (%IACS)', 'temperature (C)'])).toThrow(
      /'%IACS' is a conductivity unit, under resistivity/,
    );
  });
});

describe('a row', () => {
  const layout = parseBatchHeader([
    'id',
    'conductivity (%IACS)',
    'temperature (C)',
    'density (g/cm3)',
    'uncertainty_percent',
  ]);
  it('reads a decimal comma, converts to SI and keeps the id', () => {
    // 28 %IACS = 28 × 0.58 MS/m (IEC 60028: 100 %IACS = 58.0 MS/m); 8.53 g/cm³ = 8530 kg/m³.
    const row = parseBatchRow(['a', '28,0', '20', '8.53', ''], layout);
    expect(row).toMatchObject({ id: 'a', temperatureK: 293.15, uncertaintyPercent: 2 });
    expect('conductivitySPerM' in row && row.conductivitySPerM).toBeCloseTo(16.24e6, 0);
    expect('densityKgPerM3' in row && row.densityKgPerM3).toBeCloseTo(8530, 6);
  });
  it('says what is wrong, one reason per row', () => {
    const error = (cells: string[]) => (parseBatchRow(cells, layout) as { error?: string }).error;
    expect(error(['a', '', '20', '', ''])).toBe('conductivity is empty');
    expect(error(['a', '1e999', '20', '', ''])).toBe("conductivity '1e999' is not a number");
    expect(error(['a', '28', '-300', '', ''])).toBe(
      'temperature: temperature must be above absolute zero',
    );
    expect(error(['a', '28', '20', '0', ''])).toBe('density must be greater than zero');
    expect(error(['a', '28', '20', '', '80'])).toBe(
      "uncertainty_percent '80' is not a number from 0.1 to 50",
    );
    expect(error(['x'.repeat(101), '28', '20', '', ''])).toBe('id is longer than 100 characters');
  });
});

describe('the CSV answer', () => {
  it('quotes per RFC 4180 and defuses formula-like text; numbers stay numbers', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "x"')).toBe('"say ""x"""');
    expect(csvCell('=1+1')).toBe("'=1+1");
    expect(csvCell('-3')).toBe("'-3");
    expect(csvCell(-3)).toBe('-3');
    expect(csvCell(null)).toBe('');
    expect(batchCsvRecord({ row: 9, id: '@x', status: 'error', error: 'bad, very' })).toBe(
      `9,'@x,error,"bad, very"${',,,,,'}${',,,,'.repeat(3)}\r\n`,
    );
  });
});
