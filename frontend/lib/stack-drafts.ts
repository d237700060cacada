import { useCallback, useSyncExternalStore } from 'react';
import { toMetres } from '../../shared/units/length';
import type { Stack } from '../../shared/physics/stack';

/** A blank as a person builds it: sizes in the units they typed. */
export interface LengthEntry {
  value: number;
  unit: string;
}

export interface StackDraft {
  id: string;
  name: string;
  diameter: LengthEntry;
  /** From the face toward the coil downward. */
  layers: Array<{ alloy: string; thickness: LengthEntry }>;
}

export interface MaterialProperties {
  name: string;
  conductivitySPerM: number;
  relativePermeability: number;
  densityKgPerM3: number;
}

/** The physical stack of a draft, or a reason it cannot be one yet. */
export function stackFromDraft(
  draft: StackDraft,
  materials: Map<string, MaterialProperties>,
): Stack | string {
  if (!(draft.diameter.value > 0)) return `${draft.name}: the diameter must be greater than zero`;
  if (!draft.layers.length) return `${draft.name}: add at least one layer`;
  const layers = [];
  for (const [i, l] of draft.layers.entries()) {
    const m = materials.get(l.alloy);
    if (!m) return `${draft.name}, layer ${i + 1}: choose an alloy`;
    if (!(l.thickness.value > 0))
      return `${draft.name}, layer ${i + 1}: the thickness must be greater than zero`;
    layers.push({
      conductivitySPerM: m.conductivitySPerM,
      relativePermeability: m.relativePermeability,
      densityKgPerM3: m.densityKgPerM3,
      thicknessM: toMetres(l.thickness.value, l.thickness.unit),
    });
  }
  return { diameterM: toMetres(draft.diameter.value, draft.diameter.unit), layers };
}

/** Drafts in a URL parameter: base64url of their JSON, so a comparison can be shared as a link. */
export function encodeDrafts(drafts: StackDraft[]): string {
  const bytes = new TextEncoder().encode(JSON.stringify(drafts));
  let binary = '';
  bytes.forEach((b) => (binary += String.fromCharCode(b)));
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

export function decodeDrafts(text: string): StackDraft[] | null {
  try {
    const binary = atob(text.replace(/-/g, '+').replace(/_/g, '/'));
    const parsed = JSON.parse(
      new TextDecoder().decode(Uint8Array.from(binary, (c) => c.charCodeAt(0))),
    ) as unknown;
    if (!Array.isArray(parsed)) return null;
    return parsed.filter(
      (d): d is StackDraft =>
        typeof d === 'object' &&
        d !== null &&
        typeof d.name === 'string' &&
        Array.isArray(d.layers) &&
        typeof d.diameter?.value === 'number',
    );
  } catch {
    return null;
  }
}

/** A person's own stacks, kept in this browser until accounts exist. */
const STORAGE_KEY = 'conductory.stacks';
const listeners = new Set<() => void>();
let cache: StackDraft[] | null = null;

function read(): StackDraft[] {
  if (cache) return cache;
  try {
    cache = (JSON.parse(localStorage.getItem(STORAGE_KEY) ?? '[]') as StackDraft[]) ?? [];
  } catch {
    cache = [];
  }
  return cache;
}

export function useSavedStacks(): [StackDraft[], (next: StackDraft[]) => void] {
  const stacks = useSyncExternalStore(
    (l) => (listeners.add(l), () => listeners.delete(l)),
    read,
    () => [],
  );
  const save = useCallback((next: StackDraft[]) => {
    cache = next;
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(next));
    } catch {
      // Storage refused (private window): the stacks still live in the page and its URL.
    }
    listeners.forEach((l) => l());
  }, []);
  return [stacks, save];
}

export const newId = () => Math.random().toString(36).slice(2, 10);
