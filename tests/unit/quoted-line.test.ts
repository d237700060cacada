import { describe, expect, it } from 'vitest';
import { propertyRows } from '../../seeds/01_reference_table';
import { alloys } from '../../seeds/reference/alloys';
import type { QuotedFigure } from '../../seeds/reference/quoted-figure';
import { quotedFigures } from '../../seeds/reference/quoted-figures';
import { quotedLine, quotedLineFor } from '../../seeds/reference/quoted-line';

const figure = (over: Partial<QuotedFigure>): QuotedFigure => ({
  slug: 'cartridge-brass-c26000',
  quantity: 'conductivity',
  sourceId: 2,
  where: 'Table 2',
  value: 28,
  unit: '%IACS',
  ...over,
});

describe('the quote line beside a value (seeds/reference/quoted-line.ts)', () => {
  it('says where, the figure in the document’s unit, its temperature and temper', () => {
    expect(quotedLine(figure({ temperatureC: 20, temper: 'annealed' }))).toBe(
      'Table 2: 28 %IACS at 20 °C (annealed)',
    );
  });

  it('leaves out what the document does not state', () => {
    expect(quotedLine(figure({ where: 'p. 14', value: 6.16, unit: 'uohm.cm' }))).toBe(
      'p. 14: 6.16 µΩ·cm',
    );
    expect(quotedLine(figure({ quantity: 'relative_permeability', value: 200, unit: '1' }))).toBe(
      'Table 2: 200',
    );
  });

  it('writes a temperature coefficient against its unit', () => {
    expect(
      quotedLine(
        figure({
          quantity: 'resistivity_temperature_coefficient',
          value: 0.00393,
          unit: '1/K',
          temperatureC: 20,
        }),
      ),
    ).toBe('Table 2: 0.00393/K at 20 °C');
  });

  it('joins the figures one source gives for one value, and is null without one', () => {
    const figures = [
      figure({ temper: 'annealed' }),
      figure({ value: 27, temper: 'half hard' }),
      figure({ sourceId: 3 }),
    ];
    expect(quotedLineFor(figures, 'cartridge-brass-c26000', 'conductivity', 2)).toBe(
      'Table 2: 28 %IACS (annealed); Table 2: 27 %IACS (half hard)',
    );
    expect(quotedLineFor(figures, 'cartridge-brass-c26000', 'density', 2)).toBeNull();
  });

  it('is set by the seed exactly on the values a located figure backs', () => {
    for (const [i, a] of alloys.entries()) {
      for (const row of propertyRows(a, i + 1)) {
        const backed = quotedFigures.some(
          (f) => f.slug === a.slug && f.quantity === row.quantity && f.sourceId === row.source_id,
        );
        expect(row.quoted !== null, `${a.slug} ${row.quantity}`).toBe(backed);
      }
    }
  });
});
