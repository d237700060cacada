import { wireProblem } from '../../../components/length-field';
import type { LengthEntry, StackDraft } from '../../../lib/stack-drafts';
import type { LaunchRequest } from '../api/run-launch';

/** Everything the Pulse Bench form holds, as typed (values stay as entered, with their units). */
export interface BenchForm {
  bankPreset: BankPresetId | 'custom';
  capacitance: LengthEntry;
  voltage: LengthEntry;
  ratedVoltage: LengthEntry;
  seriesResistance: LengthEntry;
  supplyPower: LengthEntry;
  innerRadius: LengthEntry;
  outerRadius: LengthEntry;
  length: LengthEntry;
  turns: number;
  /** A gauge ('awg') or a bare diameter (mm, mil). */
  wire: LengthEntry;
  gap: LengthEntry;
  angleDeg: number;
  blankA: string;
  blankB: string;
  checkSwitch: boolean;
  surgeCurrent: LengthEntry;
  i2tRating: LengthEntry;
  withCore: boolean;
  coreRadius: LengthEntry;
  coreLength: LengthEntry;
  coreRelativePermeability: number;
  coreSaturation: LengthEntry;
}

const mm = (value: number): LengthEntry => ({ value, unit: 'mm' });

type BankFields = Pick<
  BenchForm,
  'capacitance' | 'voltage' | 'ratedVoltage' | 'seriesResistance' | 'supplyPower'
>;

/**
 * Two banks a bench builder starts from (common practice, no source; our own figures): a mains
 * bench bank, and a portable one where a battery and a small inverter charge a smaller capacitor
 * close to its rated voltage.
 */
export const bankPresets = {
  bench: {
    label: 'Bench bank: 50 µF, 400 V, mains charger',
    fields: {
      capacitance: { value: 50, unit: 'uF' },
      voltage: { value: 400, unit: 'V' },
      ratedVoltage: { value: 450, unit: 'V' },
      seriesResistance: { value: 100, unit: 'mohm' },
      supplyPower: { value: 20, unit: 'W' },
    },
  },
  portable: {
    label: 'Portable bank: 47 µF, 330 V, battery and inverter',
    fields: {
      capacitance: { value: 47, unit: 'uF' },
      voltage: { value: 330, unit: 'V' },
      ratedVoltage: { value: 350, unit: 'V' },
      seriesResistance: { value: 200, unit: 'mohm' },
      supplyPower: { value: 2, unit: 'W' },
    },
  },
} satisfies Record<string, { label: string; fields: BankFields }>;

export type BankPresetId = keyof typeof bankPresets;

/**
 * The first load: a small fine-wire coil sized for a 19 mm blank (100 turns of AWG 32 in a 5–9.5 mm
 * by 4 mm window, fill about 0.24) on the bench bank, with the two equal-size 1 mark blanks of the
 * demo scenario, so the trade's rules of thumb show at once: of order 100 A, well under 1 %
 * efficient, the solid 95/5 blank thrown several times higher than the plated zinc one (common
 * practice, no source; tests/unit/physics/pulse-bench-defaults.test.ts).
 */
export const initialBench: BenchForm = {
  bankPreset: 'bench',
  ...bankPresets.bench.fields,
  innerRadius: mm(5),
  outerRadius: mm(9.5),
  length: mm(4),
  turns: 100,
  wire: { value: 32, unit: 'awg' },
  gap: mm(0.5),
  angleDeg: 45,
  blankA: 'estmark-1-mark-solid',
  blankB: 'estmark-1-mark',
  checkSwitch: false,
  // A small thyristor's datasheet figures, of the order a 10–16 A part prints (from memory).
  surgeCurrent: { value: 160, unit: 'A' },
  i2tRating: { value: 128, unit: 'A2s' },
  withCore: false,
  // A laminated silicon-steel core filling the bore, twice the winding's length beyond it
  // (µr and saturation typical of such steel at low field: common practice, no source).
  coreRadius: mm(4.5),
  coreLength: mm(20),
  coreRelativePermeability: 1000,
  coreSaturation: { value: 1.5, unit: 'T' },
};

const ok = (e: LengthEntry, zero = false) =>
  Number.isFinite(e.value) && (zero ? e.value >= 0 : e.value > 0);

/** One plain message per field that cannot be sent as it stands. */
export function validateBench(f: BenchForm): Record<string, string> {
  const e: Record<string, string> = {};
  if (!ok(f.capacitance)) e.capacitance = 'greater than zero';
  if (!ok(f.voltage)) e.voltage = 'greater than zero';
  if (!Number.isNaN(f.ratedVoltage.value) && !ok(f.ratedVoltage))
    e.ratedVoltage = 'greater than zero, or empty';
  if (!ok(f.seriesResistance, true)) e.seriesResistance = 'zero or more';
  if (!Number.isNaN(f.supplyPower.value) && !ok(f.supplyPower))
    e.supplyPower = 'greater than zero, or empty';
  if (!ok(f.innerRadius)) e.innerRadius = 'greater than zero';
  if (!ok(f.outerRadius)) e.outerRadius = 'greater than zero';
  if (!ok(f.length)) e.length = 'greater than zero';
  if (!ok(f.gap, true)) e.gap = 'zero or more';
  if (!Number.isInteger(f.turns) || f.turns < 1) e.turns = 'a whole number, 1 or more';
  const wire = wireProblem(f.wire);
  if (wire) e.wire = wire;
  if (!Number.isFinite(f.angleDeg) || f.angleDeg < 1 || f.angleDeg > 90)
    e.angleDeg = '1 to 90 degrees';
  if (f.checkSwitch) {
    if (!ok(f.surgeCurrent)) e.surgeCurrent = 'greater than zero';
    if (!ok(f.i2tRating)) e.i2tRating = 'greater than zero';
  }
  if (f.withCore) {
    if (!ok(f.coreRadius)) e.coreRadius = 'greater than zero';
    if (!ok(f.coreLength)) e.coreLength = 'greater than zero';
    if (!Number.isFinite(f.coreRelativePermeability) || f.coreRelativePermeability < 1)
      e.coreRelativePermeability = '1 or more';
    if (!ok(f.coreSaturation)) e.coreSaturation = 'greater than zero';
  }
  return e;
}

type Req = LaunchRequest;
/** The selects offer only codes openapi.yaml accepts; this narrows the typed-in entry to them. */
const as = <T>(e: LengthEntry) => ({ value: e.value, unit: e.unit }) as T;
type Len = Req['gap'];
type Core = NonNullable<Req['coil']['core']>;

/** The launch request for one blank, with or without the core. */
export function benchRequest(f: BenchForm, blank: StackDraft, cored: boolean): LaunchRequest {
  const given = (e: LengthEntry) => Number.isFinite(e.value);
  return {
    bank: {
      capacitance: as<Req['bank']['capacitance']>(f.capacitance),
      voltage: as<Req['bank']['voltage']>(f.voltage),
      seriesResistance: as<Req['bank']['seriesResistance']>(f.seriesResistance),
      ...(given(f.ratedVoltage)
        ? { ratedVoltage: as<Req['bank']['voltage']>(f.ratedVoltage) }
        : {}),
      ...(given(f.supplyPower)
        ? { supplyPower: as<NonNullable<Req['bank']['supplyPower']>>(f.supplyPower) }
        : {}),
    },
    ...(f.checkSwitch
      ? {
          switch: {
            surgeCurrentRating: as<NonNullable<Req['switch']>['surgeCurrentRating']>(
              f.surgeCurrent,
            ),
            i2tRating: as<NonNullable<Req['switch']>['i2tRating']>(f.i2tRating),
          },
        }
      : {}),
    coil: {
      innerRadius: as<Len>(f.innerRadius),
      outerRadius: as<Len>(f.outerRadius),
      length: as<Len>(f.length),
      turns: f.turns,
      ...(f.wire.unit === 'awg' ? { awg: f.wire.value } : { wireDiameter: as<Len>(f.wire) }),
      ...(cored
        ? {
            core: {
              radius: as<Len>(f.coreRadius),
              length: as<Len>(f.coreLength),
              relativePermeability: f.coreRelativePermeability,
              saturationFluxDensity: as<Core['saturationFluxDensity']>(f.coreSaturation),
            },
          }
        : {}),
    },
    blank: {
      diameter: as<Len>(blank.diameter),
      layers: blank.layers.map((l) => ({
        material: { alloy: l.alloy },
        thickness: as<Len>(l.thickness),
      })),
    },
    gap: as<Len>(f.gap),
    launchAngleDeg: f.angleDeg,
  };
}
