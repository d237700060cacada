import { useState } from 'react';
import { LengthField } from '../../../components/length-field';
import { newId, type MaterialProperties, type StackDraft } from '../../../lib/stack-drafts';

interface Props {
  draft: StackDraft;
  materials: Map<string, MaterialProperties>;
  colour: string;
  onChange: (next: StackDraft) => void;
  onRemove: () => void;
}

function AlloySelect({
  label,
  value,
  materials,
  onChange,
}: {
  label: string;
  value: string;
  materials: Map<string, MaterialProperties>;
  onChange: (slug: string) => void;
}) {
  const options = [...materials.entries()].sort((a, b) => a[1].name.localeCompare(b[1].name));
  return (
    <select
      aria-label={label}
      className="min-w-0 flex-1 rounded border border-patina-300 bg-white px-1 py-1 text-sm"
      value={value}
      onChange={(e) => onChange(e.target.value)}
    >
      {!materials.has(value) ? <option value="">choose an alloy…</option> : null}
      {options.map(([slug, m]) => (
        <option key={slug} value={slug}>
          {m.name}
        </option>
      ))}
    </select>
  );
}

/** One blank: its name, diameter and layers, with a shortcut for a core plated on both faces. */
export function StackEditor({ draft, materials, colour, onChange, onRemove }: Props) {
  const [plating, setPlating] = useState({
    core: 'zinc-coinage-strip',
    coreT: 1.5,
    plate: 'copper-c11000',
    plateT: 10,
  });
  const setLayer = (i: number, patch: Partial<StackDraft['layers'][number]>) =>
    onChange({ ...draft, layers: draft.layers.map((l, j) => (j === i ? { ...l, ...patch } : l)) });
  return (
    <fieldset
      className="flex min-w-0 flex-col gap-3 rounded-md border-2 bg-white p-3"
      style={{ borderColor: colour }}
    >
      <legend className="px-1 text-sm font-semibold" style={{ color: colour }}>
        {draft.name || 'Unnamed blank'}
      </legend>
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-1 flex-col gap-1 text-sm">
          <span className="font-medium">Name</span>
          <input
            className="rounded border border-patina-300 px-2 py-1"
            value={draft.name}
            onChange={(e) => onChange({ ...draft, name: e.target.value })}
          />
        </label>
        <LengthField
          label="Diameter"
          entry={draft.diameter}
          onChange={(diameter) => onChange({ ...draft, diameter })}
        />
      </div>
      <div>
        <p className="mb-1 text-sm font-medium">Layers, from the face toward the coil</p>
        <ol className="flex flex-col gap-1.5">
          {draft.layers.map((layer, i) => (
            <li key={i} className="flex items-center gap-1.5">
              <span className="w-5 text-right text-xs text-ink/60">{i + 1}.</span>
              <AlloySelect
                label={`Layer ${i + 1} alloy`}
                value={layer.alloy}
                materials={materials}
                onChange={(alloy) => setLayer(i, { alloy })}
              />
              <div className="w-40">
                <LengthField
                  compact
                  label={`Layer ${i + 1} thickness`}
                  entry={layer.thickness}
                  onChange={(thickness) => setLayer(i, { thickness })}
                />
              </div>
              <button
                type="button"
                aria-label={`Remove layer ${i + 1}`}
                className="rounded px-1.5 text-copper-700 hover:bg-copper-100 disabled:opacity-30"
                disabled={draft.layers.length === 1}
                onClick={() =>
                  onChange({ ...draft, layers: draft.layers.filter((_, j) => j !== i) })
                }
              >
                ✕
              </button>
            </li>
          ))}
        </ol>
        <div className="mt-2 flex flex-wrap gap-2">
          <button
            type="button"
            className="rounded border border-patina-300 px-2 py-0.5 text-sm hover:bg-patina-50 disabled:opacity-40"
            disabled={draft.layers.length >= 8}
            onClick={() =>
              onChange({
                ...draft,
                layers: [
                  ...draft.layers,
                  { alloy: 'copper-c11000', thickness: { value: 10, unit: 'um' } },
                ],
              })
            }
          >
            Add a layer
          </button>
          <button
            type="button"
            className="rounded px-2 py-0.5 text-sm text-copper-700 hover:bg-copper-100"
            onClick={onRemove}
          >
            Remove this blank
          </button>
        </div>
      </div>
      <details className="rounded bg-paper p-2 text-sm">
        <summary className="cursor-pointer font-medium">Plated on both faces…</summary>
        <div className="mt-2 flex flex-col gap-2">
          <div className="flex items-center gap-1.5">
            <span className="w-16">Core</span>
            <AlloySelect
              label="Core alloy"
              value={plating.core}
              materials={materials}
              onChange={(core) => setPlating({ ...plating, core })}
            />
            <input
              aria-label="Core thickness in mm"
              className="w-20 rounded border border-patina-300 px-2 py-1"
              inputMode="decimal"
              value={plating.coreT}
              onChange={(e) => setPlating({ ...plating, coreT: Number(e.target.value) })}
            />
            <span>mm</span>
          </div>
          <div className="flex items-center gap-1.5">
            <span className="w-16">Plating</span>
            <AlloySelect
              label="Plating alloy"
              value={plating.plate}
              materials={materials}
              onChange={(plate) => setPlating({ ...plating, plate })}
            />
            <input
              aria-label="Plating thickness in µm"
              className="w-20 rounded border border-patina-300 px-2 py-1"
              inputMode="decimal"
              value={plating.plateT}
              onChange={(e) => setPlating({ ...plating, plateT: Number(e.target.value) })}
            />
            <span>µm</span>
          </div>
          <button
            type="button"
            className="self-start rounded bg-patina-700 px-2 py-1 text-white hover:bg-patina-900"
            onClick={() =>
              onChange({
                ...draft,
                layers: [
                  { alloy: plating.plate, thickness: { value: plating.plateT, unit: 'um' } },
                  { alloy: plating.core, thickness: { value: plating.coreT, unit: 'mm' } },
                  { alloy: plating.plate, thickness: { value: plating.plateT, unit: 'um' } },
                ],
              })
            }
          >
            Use these layers
          </button>
        </div>
      </details>
    </fieldset>
  );
}

export function blankDraft(name: string): StackDraft {
  return {
    id: newId(),
    name,
    diameter: { value: 20, unit: 'mm' },
    layers: [{ alloy: 'copper-c11000', thickness: { value: 1.5, unit: 'mm' } }],
  };
}
