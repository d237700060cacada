import { DataTable } from '../../../components/data-table';
import { Link, useParams } from 'react-router-dom';
import { FromMemoryBadge, MagneticBadge } from '../../../components/badges';
import { NominalCaution } from '../../../components/nominal-caution';
import { UnitSwitcher } from '../../../components/unit-switcher';
import { isResistivityUnit } from '../../../../shared/units/conductivity';
import {
  conductivityOverDensityName,
  conductivityQuantityName,
  familyLabels,
  formatConductivity,
  formatConductivityOverDensity,
  formatDensity,
  formatEditable,
  formatFrequency,
} from '../../../lib/format';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { useAlloy } from '../api/get-alloy';
import { HistorySection } from '../components/history-section';
import { ProposeChange } from '../components/propose-change';
import { SkinDepthSection } from '../components/skin-depth-section';
import { useMe } from '../../../lib/session';
import { ValueTable } from '../components/value-table';

function Figure({ label, value }: { label: string; value: string }) {
  // Capitals would turn σ/ρ into "Σ/Ρ", which reads as S/P: Greek labels keep their case.
  const greek = /[α-ω]/.test(label);
  return (
    <div className="rounded-md border border-patina-100 bg-white px-4 py-3">
      <dt className={`text-xs tracking-wide text-ink/60 ${greek ? '' : 'uppercase'}`}>{label}</dt>
      <dd className="text-lg font-semibold tabular-nums">{value}</dd>
    </div>
  );
}

export function AlloySheetRoute() {
  const { slug = '' } = useParams();
  const { data: alloy } = useAlloy(slug);
  const [units] = useUnitPreferences();
  const me = useMe();
  return (
    <article aria-labelledby="alloy-title" className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link to="/" className="text-patina-700 underline">
          Catalogue
        </Link>{' '}
        / {alloy.name}
      </nav>
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="alloy-title" className="text-2xl font-semibold tracking-tight">
            {alloy.name}
          </h1>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink/70">
            <span>{alloy.uns ? `UNS ${alloy.uns}` : 'no UNS number'}</span>
            <span aria-hidden="true">·</span>
            <span>{familyLabels[alloy.family]}</span>
            {alloy.condition ? (
              <>
                <span aria-hidden="true">·</span>
                <span>{alloy.condition}</span>
              </>
            ) : null}
            {alloy.magnetic ? <MagneticBadge /> : null}
            {alloy.fromMemory ? <FromMemoryBadge /> : null}
          </p>
        </div>
        <UnitSwitcher />
      </header>

      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {/* Conductivity and resistivity both, each in the chosen unit when it is of its kind. */}
        <Figure
          label="Conductivity"
          value={formatConductivity(
            alloy.conductivitySPerM,
            isResistivityUnit(units.conductivity) ? '%IACS' : units.conductivity,
          )}
        />
        <Figure
          label="Resistivity"
          value={formatConductivity(
            alloy.conductivitySPerM,
            isResistivityUnit(units.conductivity) ? units.conductivity : 'uohm_cm',
          )}
        />
        <Figure label="Density" value={formatDensity(alloy.densityKgPerM3, units.density)} />
        <Figure
          label={conductivityOverDensityName}
          value={formatConductivityOverDensity(
            alloy.conductivitySPerM / alloy.densityKgPerM3,
            units,
          )}
        />
      </dl>

      {alloy.notes ? <p className="rounded-md bg-patina-50 p-3 text-sm">{alloy.notes}</p> : null}

      <section aria-labelledby="values-title" className="flex flex-col gap-2">
        <h2 id="values-title" className="text-lg font-semibold">
          Values and sources
        </h2>
        <ValueTable values={alloy.values} units={units} />
      </section>

      {alloy.measurements?.length ? (
        <section aria-labelledby="measured-title" className="flex flex-col gap-2">
          <h2 id="measured-title" className="text-lg font-semibold">
            Measured beside the handbook
          </h2>
          <DataTable
            caption="
                Measured conductivities from imported measurement sets
              "
            headers={[
              `Measured ${conductivityQuantityName(units.conductivity).toLowerCase()}`,
              'Handbook',
              'At',
              'Uncertainty',
              'Sample',
              'Instrument',
              'Source',
            ]}
            minWidth="40rem"
          >
            {(alloy.measurements ?? []).map((m, i) => (
              <tr key={i} className="border-t border-patina-50">
                <td className="px-3 py-1.5 tabular-nums">
                  {formatConductivity(m.conductivitySPerM, units.conductivity)}
                </td>
                <td className="px-3 py-1.5 tabular-nums">
                  {formatConductivity(alloy.conductivitySPerM, units.conductivity)}
                </td>
                <td className="px-3 py-1.5">
                  {formatFrequency(m.frequencyHz)}, {formatEditable(m.temperatureK - 273.15)} °C
                </td>
                <td className="px-3 py-1.5">{formatEditable(m.uncertaintyPercent)} %</td>
                <td className="px-3 py-1.5">{m.sample}</td>
                <td className="px-3 py-1.5">{m.instrument}</td>
                <td className="px-3 py-1.5 text-xs">
                  {String((m.source as { citation?: string }).citation ?? '')}
                </td>
              </tr>
            ))}
          </DataTable>
        </section>
      ) : null}

      <SkinDepthSection
        conductivitySPerM={alloy.conductivitySPerM}
        relativePermeability={alloy.relativePermeability}
        magnetic={alloy.magnetic}
      />

      <section aria-labelledby="composition-title" className="flex flex-col gap-2">
        <h2 id="composition-title" className="text-lg font-semibold">
          Nominal composition
        </h2>
        <ul className="flex flex-wrap gap-2 text-sm">
          {alloy.composition.map((c) => (
            <li
              key={c.element}
              className="rounded border border-patina-100 bg-white px-2 py-1 tabular-nums"
            >
              <span className="font-semibold">{c.element}</span> {formatEditable(c.massPercent, 4)}{' '}
              %
            </li>
          ))}
        </ul>
        <p className="text-xs text-ink/60">
          Mass per cent; the balance and trace elements as the standard for the alloy allows.
        </p>
      </section>
      <HistorySection slug={alloy.slug} units={units} />
      {me.data && (me.data.role === 'curator' || me.data.role === 'admin') ? (
        <ProposeChange alloy={alloy} units={units} />
      ) : null}
      <NominalCaution />
    </article>
  );
}
