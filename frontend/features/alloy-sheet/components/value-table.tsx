import { FromMemoryBadge } from '../../../components/badges';
import type { PropertyValue } from '../../../lib/api-types';
import {
  conductivityQuantityName,
  formatEditable,
  formatQuantityRange,
  formatQuantityValue,
} from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';

/** Row names; conductivity is named resistivity when it is read in a resistivity unit. */
function quantityLabel(quantity: PropertyValue['quantity'], units: UnitPreferences): string {
  switch (quantity) {
    case 'conductivity':
      return `Electrical ${conductivityQuantityName(units.conductivity).toLowerCase()}`;
    case 'density':
      return 'Density';
    case 'resistivity_temperature_coefficient':
      return 'Temperature coefficient of resistivity';
    default:
      return 'Relative permeability (low field)';
  }
}

const sourceKindLabels: Record<string, string> = {
  handbook: 'handbook',
  standard: 'standard',
  paper: 'paper',
  measurement_set: 'measurement set',
  from_memory: 'from memory',
};

/** Only a web address becomes a link (a citation's url is data, never a script). */
const webAddress = (url: string | null) => (url && /^https?:\/\//i.test(url) ? url : null);

/** One value in the chosen display unit: its nominal and its range. */
function describe(
  value: PropertyValue,
  units: UnitPreferences,
): { nominal: string; range: string } {
  return {
    nominal: formatQuantityValue(value.quantity, value.nominal, units),
    range: formatQuantityRange(value.quantity, value.min, value.max, units),
  };
}

export function ValueTable({ values, units }: { values: PropertyValue[]; units: UnitPreferences }) {
  return (
    <div className="overflow-x-auto rounded-md border border-patina-100 bg-white">
      <table className="stack-table w-full border-collapse text-sm sm:min-w-[40rem]">
        <caption className="sr-only">Every value on record for this alloy, with its source</caption>
        <thead className="bg-patina-50 text-left">
          <tr>
            <th scope="col" className="px-3 py-2">
              Quantity
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Nominal
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Range
            </th>
            <th scope="col" className="px-3 py-2">
              At
            </th>
            <th scope="col" className="px-3 py-2">
              Source
            </th>
          </tr>
        </thead>
        <tbody>
          {values.map((v) => {
            const shown = describe(v, units);
            const href = webAddress(v.source.url);
            return (
              <tr key={v.quantity} className="border-t border-patina-50 align-top">
                <th scope="row" className="px-3 py-2 text-left font-medium">
                  {quantityLabel(v.quantity, units)}
                  {v.condition ? (
                    <span className="block text-xs font-normal text-ink/60">{v.condition}</span>
                  ) : null}
                </th>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  {shown.nominal}
                </td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  {shown.range}
                </td>
                <td className="px-3 py-2 whitespace-nowrap">
                  {formatEditable(v.referenceTemperatureK - 273.15)} °C
                </td>
                <td className="px-3 py-2">
                  {v.source.kind === 'from_memory' ? (
                    <FromMemoryBadge />
                  ) : (
                    <span className="mr-1.5 text-xs uppercase tracking-wide text-patina-700">
                      {sourceKindLabels[v.source.kind]}
                    </span>
                  )}
                  <span className="block">
                    {href ? (
                      <a
                        href={href}
                        className="text-patina-700 underline underline-offset-2"
                        rel="noopener noreferrer"
                      >
                        {v.source.citation}
                      </a>
                    ) : (
                      v.source.citation
                    )}
                  </span>
                  {v.source.locator ? (
                    <span className="block text-xs text-ink/60">{v.source.locator}</span>
                  ) : null}
                  {v.quoted ? (
                    <span className="mt-1 block text-xs">
                      <span className="font-medium">The source prints: </span>
                      {v.quoted}
                    </span>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
