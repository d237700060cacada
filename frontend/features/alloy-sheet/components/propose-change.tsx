import { useMutation } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import {
  fromSiemensPerMetre,
  isResistivityUnit,
  toSiemensPerMetre,
} from '../../../../shared/units/conductivity';
import { unitLabel } from '../../../../shared/units/codes';
import {
  fromKilogramsPerCubicMetre,
  toKilogramsPerCubicMetre,
} from '../../../../shared/units/density';
import { ProblemMessage } from '../../../components/problem-message';
import { inputClass, QuantityInput } from '../../../components/quantity-input';
import { apiPost } from '../../../lib/api-client';
import type { Alloy } from '../../../lib/api-types';
import { conductivityQuantityName, formatEditable } from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';

const electricalUnits = ['%IACS', 'MS/m', 'S/m', 'uohm_cm', 'nohm_m'];
const densityUnits = ['g/cm3', 'kg/m3', 'lb/in3'];

interface ProposeForm {
  nominal: string;
  from: string;
  to: string;
  conductivityUnit: string;
  density: string;
  densityUnit: string;
  notes: string;
  citation: string;
  kind: string;
  locator: string;
  reason: string;
}

const toNumber = (text: string) => Number(text.trim().replace(',', '.'));
const shown = (sPerM: number | null | undefined, unit: string) =>
  sPerM == null ? '' : formatEditable(fromSiemensPerMetre(sPerM, unit), 4);

/** The range ends of a conductivity as a person reads them in a unit: a resistivity swaps them. */
function rangeIn(min: number | null, max: number | null, unit: string): [string, string] {
  return isResistivityUnit(unit)
    ? [shown(max, unit), shown(min, unit)]
    : [shown(min, unit), shown(max, unit)];
}

const positive = (text: string) =>
  (Number.isFinite(toNumber(text)) && toNumber(text) > 0) || 'a number greater than zero';
const optionalPositive = (text: string) => text.trim() === '' || positive(text);

/**
 * A curator's proposal for this alloy: new figures in any unit (converted to SI on submit) with a
 * source and a reason, for a second curator to review.
 */
export function ProposeChange({ alloy, units }: { alloy: Alloy; units: UnitPreferences }) {
  const c = alloy.values.find((v) => v.quantity === 'conductivity')!;
  const d = alloy.values.find((v) => v.quantity === 'density')!;
  const [from, to] = rangeIn(c.min, c.max, units.conductivity);
  const initial: ProposeForm = {
    nominal: shown(c.nominal, units.conductivity),
    from,
    to,
    conductivityUnit: units.conductivity,
    density: formatEditable(fromKilogramsPerCubicMetre(d.nominal, units.density), 4),
    densityUnit: units.density,
    notes: alloy.notes ?? '',
    citation: '',
    kind: 'handbook',
    locator: '',
    reason: '',
  };
  const {
    register,
    handleSubmit,
    getValues,
    setValue,
    control,
    formState: { errors },
  } = useForm<ProposeForm>({ defaultValues: initial });
  const unit = useWatch({ control, name: 'conductivityUnit' });

  // Switching a unit converts what is in the boxes, so the figure stays the same quantity.
  const convertConductivity = (previous: string, next: string) => {
    const v = getValues();
    const inNext = (text: string) =>
      positive(text) === true
        ? formatEditable(fromSiemensPerMetre(toSiemensPerMetre(toNumber(text), previous), next), 4)
        : text;
    const swap = isResistivityUnit(previous) !== isResistivityUnit(next);
    setValue('nominal', inNext(v.nominal));
    setValue('from', inNext(swap ? v.to : v.from));
    setValue('to', inNext(swap ? v.from : v.to));
  };
  const convertDensity = (previous: string, next: string) => {
    const text = getValues('density');
    if (positive(text) === true)
      setValue(
        'density',
        formatEditable(
          fromKilogramsPerCubicMetre(toKilogramsPerCubicMetre(toNumber(text), previous), next),
          4,
        ),
      );
  };
  const conductivityUnitField = register('conductivityUnit');
  const densityUnitField = register('densityUnit');

  // Which figures the person has typed: the others are sent as stored, not as a rounded round trip.
  const [edited, setEdited] = useState({ conductivity: false, density: false });
  const markConductivity = () =>
    setEdited((e) => (e.conductivity ? e : { ...e, conductivity: true }));
  const markDensity = () => setEdited((e) => (e.density ? e : { ...e, density: true }));

  // The page's unit switch moves the form to the new units too: stored figures are shown afresh,
  // typed ones converted.
  const shownUnits = useRef({ conductivity: units.conductivity, density: units.density });
  useEffect(() => {
    const was = shownUnits.current;
    if (was.conductivity !== units.conductivity) {
      if (edited.conductivity)
        convertConductivity(getValues('conductivityUnit'), units.conductivity);
      else {
        const [lo, hi] = rangeIn(c.min, c.max, units.conductivity);
        setValue('nominal', shown(c.nominal, units.conductivity));
        setValue('from', lo);
        setValue('to', hi);
      }
      setValue('conductivityUnit', units.conductivity);
    }
    if (was.density !== units.density) {
      if (edited.density) convertDensity(getValues('densityUnit'), units.density);
      else
        setValue(
          'density',
          formatEditable(fromKilogramsPerCubicMetre(d.nominal, units.density), 4),
        );
      setValue('densityUnit', units.density);
    }
    shownUnits.current = { conductivity: units.conductivity, density: units.density };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- runs on a change of the page's units only
  }, [units.conductivity, units.density]);

  const propose = useMutation({
    mutationFn: (form: ProposeForm) => {
      // A figure never typed sends the stored SI figure, not a rounded round trip of it.
      const untouched = (key: 'nominal' | 'from' | 'to' | 'density') =>
        key === 'density' ? !edited.density : !edited.conductivity;
      const si = (text: string) =>
        text.trim() === '' ? null : toSiemensPerMetre(toNumber(text), form.conductivityUnit);
      const nominal = untouched('nominal') ? c.nominal : si(form.nominal)!;
      let min: number | null;
      let max: number | null;
      if (untouched('from') && untouched('to')) {
        min = c.min;
        max = c.max;
      } else {
        const ends = [si(form.from), si(form.to)];
        const known = ends.filter((x): x is number => x !== null).sort((a, b) => a - b);
        if (known.length === 2) [min, max] = known as [number, number];
        else {
          // one end given: a resistivity "from" is a conductivity "to"
          const swap = isResistivityUnit(form.conductivityUnit);
          min = swap ? ends[1]! : ends[0]!;
          max = swap ? ends[0]! : ends[1]!;
        }
      }
      const density = untouched('density')
        ? d.nominal
        : toKilogramsPerCubicMetre(toNumber(form.density), form.densityUnit);
      return apiPost<{ id: number }>('/api/v1/revisions', {
        kind: 'edit',
        alloy: alloy.slug,
        set: {
          ...(form.notes !== (alloy.notes ?? '') ? { notes: form.notes || null } : {}),
          values: {
            conductivity: { nominal, min, max },
            density: { nominal: density },
          },
        },
        source: { citation: form.citation, kind: form.kind, locator: form.locator || null },
        reason: form.reason,
      });
    },
  });

  const text = (key: 'notes' | 'citation' | 'locator' | 'reason', label: string, wide = false) => (
    <label className={`flex flex-col gap-1 text-sm ${wide ? 'sm:col-span-2' : ''}`}>
      <span className="font-medium">{label}</span>
      <input className={inputClass} {...register(key)} />
    </label>
  );
  const rangeEnd = (key: 'from' | 'to', label: string) => (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={`propose-${key}`} className="font-medium">
        {label}
      </label>
      <div className="flex items-center gap-1.5">
        <input
          id={`propose-${key}`}
          className={inputClass}
          inputMode="decimal"
          aria-invalid={errors[key] ? true : undefined}
          {...register(key, { validate: optionalPositive, onChange: markConductivity })}
        />
        <span className="whitespace-nowrap text-ink/70">{unitLabel(unit)}</span>
      </div>
      {errors[key] ? <p className="text-xs text-copper-700">{errors[key].message}</p> : null}
    </div>
  );
  return (
    <details className="rounded-md border border-patina-100 bg-white p-3">
      <summary className="cursor-pointer font-semibold">Propose a change (curators)</summary>
      {propose.isSuccess ? (
        <p role="status" className="mt-2 text-sm">
          Proposed as revision {propose.data.id}. It applies once a second curator approves it on
          the Review Desk.
        </p>
      ) : (
        <form
          noValidate
          className="mt-3 grid gap-3 sm:grid-cols-2"
          onSubmit={handleSubmit((form) => propose.mutate(form))}
        >
          <div className="sm:col-span-2">
            <QuantityInput
              id="propose-conductivity"
              label={`${conductivityQuantityName(unit)}, nominal`}
              hint="Conductivity or resistivity, in any unit: it is stored in S/m."
              error={errors.nominal}
              value={register('nominal', { validate: positive, onChange: markConductivity })}
              unit={{
                ...conductivityUnitField,
                onChange: (e) => {
                  convertConductivity(getValues('conductivityUnit'), String(e.target.value));
                  return conductivityUnitField.onChange(e);
                },
              }}
              units={electricalUnits}
            />
          </div>
          {rangeEnd('from', 'Range from')}
          {rangeEnd('to', 'Range to')}
          <div className="sm:col-span-2">
            <QuantityInput
              id="propose-density"
              label="Density"
              error={errors.density}
              value={register('density', { validate: positive, onChange: markDensity })}
              unit={{
                ...densityUnitField,
                onChange: (e) => {
                  convertDensity(getValues('densityUnit'), String(e.target.value));
                  return densityUnitField.onChange(e);
                },
              }}
              units={densityUnits}
            />
          </div>
          {text('notes', 'Notes', true)}
          {text('citation', 'Source: citation (required)', true)}
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium">Kind of source</span>
            <select className={inputClass} {...register('kind')}>
              <option value="handbook">handbook</option>
              <option value="standard">standard</option>
              <option value="paper">paper</option>
              <option value="measurement_set">measurement set</option>
            </select>
          </label>
          {text('locator', 'Table or page')}
          {text('reason', 'Reason (required)', true)}
          {propose.isError ? (
            <div className="sm:col-span-2">
              <ProblemMessage error={propose.error} title="Not proposed" />
            </div>
          ) : null}
          <button
            type="submit"
            className="rounded bg-copper-500 px-4 py-2 text-white hover:bg-copper-700 sm:col-span-1"
            disabled={propose.isPending}
          >
            Propose for review
          </button>
        </form>
      )}
    </details>
  );
}
