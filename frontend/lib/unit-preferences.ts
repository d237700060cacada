import { useCallback, useSyncExternalStore } from 'react';

/** The units a person reads figures in, remembered in this browser. */
export interface UnitPreferences {
  conductivity: 'S/m' | 'MS/m' | '%IACS' | 'uohm_cm' | 'nohm_m' | 'ohm_m';
  density: 'kg/m3' | 'g/cm3' | 'lb/in3';
}

const STORAGE_KEY = 'conductory.units';
const defaults: UnitPreferences = { conductivity: '%IACS', density: 'g/cm3' };
const listeners = new Set<() => void>();
let current: UnitPreferences | null = null;

function read(): UnitPreferences {
  if (current) return current;
  try {
    const stored = JSON.parse(
      localStorage.getItem(STORAGE_KEY) ?? 'null',
    ) as Partial<UnitPreferences> | null;
    current = { ...defaults, ...stored };
  } catch {
    current = defaults;
  }
  return current;
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function useUnitPreferences(): [UnitPreferences, (next: Partial<UnitPreferences>) => void] {
  const prefs = useSyncExternalStore(subscribe, read, () => defaults);
  const update = useCallback((next: Partial<UnitPreferences>) => {
    current = { ...read(), ...next };
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(current));
    } catch {
      // Private windows may refuse storage; the choice still holds for this page.
    }
    listeners.forEach((l) => l());
  }, []);
  return [prefs, update];
}
