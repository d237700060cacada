import { IACS_100_S_PER_M } from '../../../../shared/units/conductivity';
import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { ProblemMessage } from '../../../components/problem-message';
import { apiPost } from '../../../lib/api-client';
import type { Alloy } from '../../../lib/api-types';

/** S/m per %IACS (IEC 60028). */
const IACS = IACS_100_S_PER_M / 100;
const field = 'rounded border border-patina-300 px-2 py-1';

/** A curator's proposal for this alloy: new figures with a source and a reason, for a second curator to review. */
export function ProposeChange({ alloy }: { alloy: Alloy }) {
  const c = alloy.values.find((v) => v.quantity === 'conductivity')!;
  const d = alloy.values.find((v) => v.quantity === 'density')!;
  const round = (x: number | null | undefined, k: number) =>
    x == null ? '' : String(Number((x / k).toPrecision(4)));
  const initial = {
    nominal: round(c.nominal, IACS),
    min: round(c.min, IACS),
    max: round(c.max, IACS),
    density: round(d.nominal, 1000),
  };
  const [form, setForm] = useState({
    ...initial,
    notes: alloy.notes ?? '',
    citation: '',
    kind: 'handbook',
    locator: '',
    reason: '',
  });
  const propose = useMutation({
    mutationFn: () =>
      apiPost<{ id: number }>('/api/v1/revisions', {
        kind: 'edit',
        alloy: alloy.slug,
        set: {
          ...(form.notes !== (alloy.notes ?? '') ? { notes: form.notes || null } : {}),
          values: {
            conductivity: {
              nominal: Number(form.nominal) * IACS,
              min: form.min ? Number(form.min) * IACS : null,
              max: form.max ? Number(form.max) * IACS : null,
            },
            density: { nominal: Number(form.density) * 1000 },
          },
        },
        source: { citation: form.citation, kind: form.kind, locator: form.locator || null },
        reason: form.reason,
      }),
  });
  const input = (key: keyof typeof form, label: string, wide = false) => (
    <label className={`flex flex-col gap-1 text-sm ${wide ? 'sm:col-span-3' : ''}`}>
      <span className="font-medium">{label}</span>
      <input
        className={field}
        value={form[key]}
        onChange={(e) => setForm({ ...form, [key]: e.target.value })}
      />
    </label>
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
          className="mt-3 grid gap-3 sm:grid-cols-3"
          onSubmit={(e) => {
            e.preventDefault();
            propose.mutate();
          }}
        >
          {input('nominal', 'Conductivity, nominal (%IACS)')}
          {input('min', 'from (%IACS)')}
          {input('max', 'to (%IACS)')}
          {input('density', 'Density (g/cm³)')}
          {input('notes', 'Notes', true)}
          {input('citation', 'Source: citation (required)', true)}
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium">Kind of source</span>
            <select
              className={field}
              value={form.kind}
              onChange={(e) => setForm({ ...form, kind: e.target.value })}
            >
              <option value="handbook">handbook</option>
              <option value="standard">standard</option>
              <option value="paper">paper</option>
              <option value="measurement_set">measurement set</option>
            </select>
          </label>
          {input('locator', 'Table or page')}
          {input('reason', 'Reason (required)', true)}
          {propose.isError ? (
            <div className="sm:col-span-3">
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
