import { describe, expect, it } from 'vitest';
import { LAUNCH } from '../../../shared/checks/references';
import { ballistics, simulateLaunch, type LaunchInput } from '../../../shared/physics/launch';
import { STANDARD_GRAVITY } from '../../../shared/physics/constants';
import type { StackLayer } from '../../../shared/physics/stack';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const layer = (iacs: number, density: number, t: number): StackLayer => ({
  conductivitySPerM: iacs * 0.58e6,
  relativePermeability: 1,
  densityKgPerM3: density,
  thicknessM: t,
});

const { fixture } = LAUNCH;
/** The fixture's case: 50 µF at 400 V into 100 turns of AWG 26, a 23 mm gilding-metal blank. */
const base: LaunchInput = LAUNCH.input;
const solid = simulateLaunch(base);

describe('pulsed launch against the SciPy solve_ivp fixture of the same model', () => {
  it('has the same drive-coil inductance (filament sum), within 1e-9', () => {
    expect(rel(solid.coilInductanceH, fixture.result.L1)).toBeLessThan(1e-9);
  });
  it('peaks at the same current within 0.5 % and the same time within 5 %', () => {
    expect(rel(solid.peakCurrentA, fixture.result.peakCurrentA)).toBeLessThan(0.005);
    expect(rel(solid.peakCurrentTimeS, fixture.result.peakCurrentTimeS)).toBeLessThan(0.05);
  });
  it('leaves at the same speed within 1 %', () => {
    expect(rel(solid.exitSpeedMPerS, fixture.result.speedAtEndMPerS)).toBeLessThan(0.01);
  });
});

describe('pulsed launch properties', () => {
  it(`balances its energy ledger within 1 % of the stored energy (${LAUNCH.ledger.source})`, () => {
    const e = solid.energy;
    expect(
      Math.abs(e.storedJ - e.coilLossJ - e.blankLossJ - e.kineticJ - e.residualJ) / e.storedJ,
    ).toBeLessThan(LAUNCH.ledger.tolerance);
    expect(Math.abs(e.imbalanceJ) / e.storedJ).toBeLessThan(LAUNCH.ledger.tolerance);
  });

  it('changes the exit speed by less than 2 % with more filaments', () => {
    const finer = simulateLaunch({
      ...base,
      filaments: { coilRadial: 6, coilAxial: 6, blankRadial: 12, blankPerLayer: 3 },
    });
    expect(rel(finer.exitSpeedMPerS, solid.exitSpeedMPerS)).toBeLessThan(0.02);
  });

  it('stops once the blank has left the field, with a time series to draw', () => {
    expect(solid.series.length).toBeGreaterThan(20);
    expect(solid.series.length).toBeLessThanOrEqual(302);
    expect(solid.endTimeS).toBeGreaterThan(solid.peakCurrentTimeS);
    expect(solid.impulseNs).toBeGreaterThan(0);
  });

  it('throws with a range of zero when launched straight up, and the height from where it ends', () => {
    expect(solid.rangeM).toBeCloseTo(0, 12);
    expect(solid.heightM).toBeCloseTo(
      solid.series.at(-1)!.displacementM + solid.exitSpeedMPerS ** 2 / (2 * 9.80665),
      12,
    );
    const angled = simulateLaunch({ ...base, launchAngleDeg: 45 });
    expect(angled.rangeM).toBeGreaterThan(0);
  });

  it('warns that a magnetic layer is outside the model', () => {
    const steel = simulateLaunch({
      ...base,
      blank: {
        diameterM: 21e-3,
        layers: [{ ...layer(12, 7870, 1.6e-3), relativePermeability: 100 }],
      },
    });
    expect(steel.warnings[0]).toMatchObject({ code: 'magnetic-layer', message: /magnetic/ });
  });
});

describe('trade facts (common practice, no source)', () => {
  it('50 µF at 400 V stores 4 J (½CV², arithmetic)', () => {
    expect(solid.energy.storedJ).toBeCloseTo(4, 12);
  });

  it('a 100-turn fine-wire coil on that bank peaks in the order of 100 A and is under 1 % efficient', () => {
    expect(solid.peakCurrentA).toBeGreaterThan(30);
    expect(solid.peakCurrentA).toBeLessThan(300);
    expect(solid.efficiency).toBeLessThan(0.01);
  });

  it('a solid high-conductivity copper-alloy blank rises several times higher than a copper-plated zinc one', () => {
    const copper = simulateLaunch({
      ...base,
      blank: { diameterM: 23e-3, layers: [layer(100, 8890, 1.75e-3)] },
    });
    const platedZinc = simulateLaunch({
      ...base,
      blank: {
        diameterM: 23e-3,
        layers: [layer(100, 8890, 8e-6), layer(27.5, 7140, 1.734e-3), layer(100, 8890, 8e-6)],
      },
    });
    expect(copper.heightM / platedZinc.heightM).toBeGreaterThan(2.5);
  });
});

describe('apex height including the rise during the pulse (issue 10)', () => {
  const g = STANDARD_GRAVITY;
  it('ballistics: from the start it is the textbook v²sin²θ/2g and v²sin 2θ/g (projectile motion)', () => {
    const b = ballistics(0, 3, Math.PI / 4);
    expect(b.heightM).toBeCloseTo((9 * 0.5) / (2 * g), 12);
    expect(b.rangeM).toBeCloseTo(9 / g, 12);
  });
  it('ballistics: from a raised point, the apex adds the rise and the range lands at the start height', () => {
    const theta = Math.PI / 6;
    const b = ballistics(0.02, 3, theta);
    expect(b.heightM).toBeCloseTo(0.02 * 0.5 + (1.5 * 1.5) / (2 * g), 12);
    // The landing point: y(t) = 0.01 + 1.5t − g t²/2 = 0 and x = 0.02 cos θ + 3 cos θ · t.
    const t = (1.5 + Math.sqrt(2.25 + 2 * g * 0.01)) / g;
    expect(b.rangeM).toBeCloseTo(0.02 * Math.cos(theta) + 3 * Math.cos(theta) * t, 12);
  });
  it('the old (final-speed-only) height is smaller; the difference is the rise during the pulse', () => {
    const old = solid.exitSpeedMPerS ** 2 / (2 * g);
    const rise = solid.series.at(-1)!.displacementM;
    expect(rise).toBeGreaterThan(0);
    expect(solid.heightM).toBeGreaterThan(old);
    expect(solid.heightM - old).toBeCloseTo(rise, 12);
  });
  it('an angled launch: range from the same trajectory, longer than the from-the-start formula', () => {
    const angled = simulateLaunch({ ...base, launchAngleDeg: 45 });
    const v = angled.exitSpeedMPerS;
    expect(angled.rangeM).toBeGreaterThan((v * v) / g);
    expect(angled.heightM).toBeGreaterThan((v * v) / (4 * g));
  });
});

describe('compute limit', () => {
  it('stops with a clear error once its deadline has passed', () => {
    expect(() => simulateLaunch({ ...base, deadline: performance.now() - 1 })).toThrow(
      /compute time limit/,
    );
  });
});
