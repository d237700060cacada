import { useId, useState } from 'react';
import type { MaterialProperties, StackDraft } from '../../../lib/stack-drafts';
import type { ProductEntry } from '../plan-model';
import { planColours } from './plan-colours';

const describe = (p: ProductEntry, materials?: Map<string, MaterialProperties>) =>
  p.kind === 'alloy'
    ? `solid ${materials?.get(p.alloy)?.name ?? p.alloy}`
    : p.kind === 'stack'
      ? 'built-in stack (invented demo coin)'
      : `your blank, ${p.draft.layers.length} layer${p.draft.layers.length === 1 ? '' : 's'}`;

/** The products of the plan, with the presets and the ways to add one. */
export function ProductList({
  products,
  onChange,
  presets,
  materials,
  savedStacks,
  max,
}: {
  products: ProductEntry[];
  onChange: (next: ProductEntry[]) => void;
  presets: Array<{ label: string; products: ProductEntry[] }>;
  materials?: Map<string, MaterialProperties>;
  savedStacks: StackDraft[];
  max: number;
}) {
  const alloyId = useId();
  const stackId = useId();
  const [alloy, setAlloy] = useState('');
  const unique = (name: string) => {
    let n = name;
    for (let i = 2; products.some((p) => p.name === n); i++) n = `${name} (${i})`;
    return n;
  };
  const full = products.length >= max;
  return (
    <section
      aria-labelledby="products-title"
      className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4"
    >
      <h2 id="products-title" className="text-sm font-semibold">
        Products on the line ({products.length} of at most {max})
      </h2>
      <div className="flex flex-wrap gap-2">
        {presets.map((p) => (
          <button
            key={p.label}
            type="button"
            className="rounded border border-patina-300 px-3 py-1 text-sm hover:bg-patina-50"
            onClick={() => onChange(p.products.slice(0, max))}
          >
            {p.label}
          </button>
        ))}
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1 text-sm">
          <label htmlFor={alloyId} className="font-medium">
            Add an alloy of the table
          </label>
          <div className="flex gap-2">
            <select
              id={alloyId}
              className="max-w-56 rounded border border-patina-300 bg-white px-2 py-1"
              value={alloy}
              onChange={(e) => setAlloy(e.target.value)}
            >
              <option value="">choose…</option>
              {[...(materials ?? new Map<string, MaterialProperties>())]
                .sort((a, b) => a[1].name.localeCompare(b[1].name))
                .map(([slug, m]) => (
                  <option key={slug} value={slug}>
                    {m.name}
                  </option>
                ))}
            </select>
            <button
              type="button"
              disabled={!alloy || full}
              className="rounded border border-patina-300 px-3 py-1 text-sm hover:bg-patina-50 disabled:opacity-40"
              onClick={() => {
                onChange([
                  ...products,
                  { name: unique(materials?.get(alloy)?.name ?? alloy), kind: 'alloy', alloy },
                ]);
                setAlloy('');
              }}
            >
              Add
            </button>
          </div>
        </div>
        {savedStacks.length ? (
          <div className="flex flex-col gap-1 text-sm">
            <label htmlFor={stackId} className="font-medium">
              Add one of your stacks
            </label>
            <select
              id={stackId}
              className="max-w-56 rounded border border-patina-300 bg-white px-2 py-1"
              value=""
              disabled={full}
              onChange={(e) => {
                const d = savedStacks.find((s) => s.id === e.target.value);
                if (d)
                  onChange([
                    ...products,
                    { name: unique(d.name || 'My blank'), kind: 'blank', draft: d },
                  ]);
              }}
            >
              <option value="">choose…</option>
              {savedStacks.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name || 'Unnamed blank'}
                </option>
              ))}
            </select>
          </div>
        ) : null}
      </div>
      {products.length ? (
        <ul className="flex flex-col gap-1 text-sm" aria-label="Products in the plan">
          {products.map((p, i) => (
            <li key={p.name} className="flex flex-wrap items-center gap-2">
              <span className="font-medium" style={{ color: planColours[i % planColours.length] }}>
                {p.name}
              </span>
              <span className="text-ink/60">{describe(p, materials)}</span>
              <button
                type="button"
                className="ml-auto rounded px-2 text-xs text-copper-700 hover:bg-copper-100"
                aria-label={`Remove ${p.name}`}
                onClick={() => onChange(products.filter((x) => x !== p))}
              >
                Remove
              </button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink/60">No products yet: start from a preset or add alloys.</p>
      )}
    </section>
  );
}
