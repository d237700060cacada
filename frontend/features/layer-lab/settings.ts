import { awgDiameter } from '../../../shared/physics/awg';
import { toMetres } from '../../../shared/units/length';
import { wireProblem } from '../../components/length-field';
import type { LengthEntry } from '../../lib/stack-drafts';
import type { CompareRequest } from './worker/protocol';

/** The probe, the sweep and the launcher the comparison runs with, as a person enters them. */
export interface LabSettings {
  sensor: {
    innerRadius: LengthEntry;
    outerRadius: LengthEntry;
    length: LengthEntry;
    turns: number;
    liftOff: LengthEntry;
  };
  sweep: { fromKHz: number; toKHz: number; points: number };
  probeKHz: number;
  launch: {
    capacitanceUF: number;
    voltageV: number;
    seriesResistanceOhm: number;
    coil: {
      innerRadius: LengthEntry;
      outerRadius: LengthEntry;
      length: LengthEntry;
      turns: number;
      /** A gauge ('awg') or a bare diameter in a length unit. */
      wire: LengthEntry;
    };
    gap: LengthEntry;
  };
}

const mm = (value: number): LengthEntry => ({ value, unit: 'mm' });

/** A small pencil probe and Pulse Bench's launcher: 50 µF at 400 V into 100 turns of AWG 32. */
export const defaultSettings: LabSettings = {
  sensor: { innerRadius: mm(2), outerRadius: mm(4), length: mm(2), turns: 100, liftOff: mm(0.5) },
  sweep: { fromKHz: 0.1, toKHz: 10000, points: 200 },
  probeKHz: 60,
  launch: {
    capacitanceUF: 50,
    voltageV: 400,
    seriesResistanceOhm: 0.1,
    coil: {
      innerRadius: mm(5),
      outerRadius: mm(9.5),
      length: mm(4),
      turns: 100,
      wire: { value: 32, unit: 'awg' },
    },
    gap: mm(0.5),
  },
};

export type SettingsErrors = Partial<Record<string, string>>;

const positive = (v: number) => Number.isFinite(v) && v > 0;

/** Every rule the calculation needs, with the message shown beside the field. */
export function validateSettings(s: LabSettings): SettingsErrors {
  const e: SettingsErrors = {};
  const len = (key: string, entry: LengthEntry, allowZero = false) => {
    if (!Number.isFinite(entry.value) || entry.value < 0 || (!allowZero && entry.value === 0))
      e[key] = allowZero ? 'zero or more' : 'greater than zero';
  };
  len('sensor.innerRadius', s.sensor.innerRadius);
  len('sensor.outerRadius', s.sensor.outerRadius);
  len('sensor.length', s.sensor.length);
  len('sensor.liftOff', s.sensor.liftOff, true);
  if (
    !e['sensor.outerRadius'] &&
    !e['sensor.innerRadius'] &&
    toMetres(s.sensor.outerRadius.value, s.sensor.outerRadius.unit) <=
      toMetres(s.sensor.innerRadius.value, s.sensor.innerRadius.unit)
  )
    e['sensor.outerRadius'] = 'larger than the inner radius';
  if (!Number.isInteger(s.sensor.turns) || s.sensor.turns < 1)
    e['sensor.turns'] = 'a whole number, 1 or more';
  if (!positive(s.sweep.fromKHz)) e['sweep.fromKHz'] = 'greater than zero';
  if (!positive(s.sweep.toKHz) || s.sweep.toKHz <= s.sweep.fromKHz)
    e['sweep.toKHz'] = 'above the start';
  if (!Number.isInteger(s.sweep.points) || s.sweep.points < 2 || s.sweep.points > 500)
    e['sweep.points'] = '2 to 500';
  if (!positive(s.probeKHz)) e.probeKHz = 'greater than zero';
  const l = s.launch;
  if (!positive(l.capacitanceUF)) e['launch.capacitanceUF'] = 'greater than zero';
  if (!positive(l.voltageV)) e['launch.voltageV'] = 'greater than zero';
  if (!Number.isFinite(l.seriesResistanceOhm) || l.seriesResistanceOhm < 0)
    e['launch.seriesResistanceOhm'] = 'zero or more';
  len('launch.coil.innerRadius', l.coil.innerRadius);
  len('launch.coil.outerRadius', l.coil.outerRadius);
  len('launch.coil.length', l.coil.length);
  len('launch.gap', l.gap, true);
  if (
    !e['launch.coil.outerRadius'] &&
    !e['launch.coil.innerRadius'] &&
    toMetres(l.coil.outerRadius.value, l.coil.outerRadius.unit) <=
      toMetres(l.coil.innerRadius.value, l.coil.innerRadius.unit)
  )
    e['launch.coil.outerRadius'] = 'larger than the inner radius';
  if (!Number.isInteger(l.coil.turns) || l.coil.turns < 1)
    e['launch.coil.turns'] = 'a whole number, 1 or more';
  const wire = wireProblem(l.coil.wire);
  if (wire) e['launch.coil.wire'] = wire;
  return e;
}

const m = (entry: LengthEntry) => toMetres(entry.value, entry.unit);

/** The SI request for the worker, minus the blanks. */
export function requestFromSettings(s: LabSettings): Omit<CompareRequest, 'blanks'> {
  const n = s.sweep.points;
  const f0 = s.sweep.fromKHz * 1e3;
  const f1 = s.sweep.toKHz * 1e3;
  return {
    sensor: {
      coil: {
        innerRadiusM: m(s.sensor.innerRadius),
        outerRadiusM: m(s.sensor.outerRadius),
        lengthM: m(s.sensor.length),
        turns: s.sensor.turns,
      },
      liftOffM: m(s.sensor.liftOff),
    },
    frequenciesHz: Array.from({ length: n }, (_, i) => f0 * (f1 / f0) ** (i / (n - 1))),
    launch: {
      bank: {
        capacitanceF: s.launch.capacitanceUF * 1e-6,
        voltageV: s.launch.voltageV,
        seriesResistanceOhm: s.launch.seriesResistanceOhm,
      },
      coil: {
        innerRadiusM: m(s.launch.coil.innerRadius),
        outerRadiusM: m(s.launch.coil.outerRadius),
        lengthM: m(s.launch.coil.length),
        turns: s.launch.coil.turns,
        wireDiameterM:
          s.launch.coil.wire.unit === 'awg'
            ? awgDiameter(s.launch.coil.wire.value)
            : m(s.launch.coil.wire),
        conductorSPerM: 58e6,
      },
      gapM: m(s.launch.gap),
    },
  };
}
