import {
  apparentConductivitySweep,
  ComputeTimeExceededError,
  conductivityLimits,
} from '../../shared/physics/apparent-conductivity';
import type { CoilGeometry } from '../../shared/physics/coil';
import {
  coilInAirInductance,
  impedanceAt,
  type ConductorLayer,
} from '../../shared/physics/dodd-deeds';
import { simulateLaunch, type LaunchInput } from '../../shared/physics/launch';
import { apparentConductivityWarnings } from '../../shared/physics/sensor-warnings';
import type { EstimateWarning } from '../../shared/physics/warnings';
import { runEngineChecks } from '../../shared/checks/engine-checks';
import { evaluateSortPlan, type PlanInput } from '../../shared/physics/sort-plan';
import { percentIacs } from '../../shared/units/conductivity';
import { kernelFor } from './kernel-cache';

/** A coil over layers at some frequencies, in SI. */
export interface SensorJob {
  kind: 'impedance' | 'apparent-conductivity';
  coil: CoilGeometry;
  liftOffM: number;
  layers: ConductorLayer[];
  frequenciesHz: number[];
}

export interface LaunchJob {
  kind: 'launch';
  input: Omit<LaunchInput, 'deadline'>;
}

/** The engine against its references (GET /api/v1/checks): fixed inputs, nothing from a caller. */
export interface ChecksJob {
  kind: 'checks';
}

/** A sort plan, resolved against the table: SI numbers and materials with their ranges. */
export interface SortPlanJob {
  kind: 'sort-plan';
  input: PlanInput;
}

/** A calculation as it crosses into a worker thread: SI numbers only, already validated. */
export type EstimateJob = (SensorJob | LaunchJob | ChecksJob | SortPlanJob) & {
  computeLimitMs: number;
};

/**
 * What comes back. Expected failures travel as values, not thrown errors, because an Error's
 * class and extra fields do not survive the trip between threads.
 */
export type EstimateOutcome =
  | { ok: true; value: unknown }
  | { ok: false; kind: 'too-slow'; message: string }
  | { ok: false; kind: 'outside-model'; field: string; message: string };

function impedancePoints(job: SensorJob, deadline: number) {
  const kernel = kernelFor(job.coil, job.liftOffM);
  const l0 = coilInAirInductance(kernel);
  return {
    points: job.frequenciesHz.map((f) => {
      if (performance.now() > deadline) throw new ComputeTimeExceededError();
      const p = impedanceAt(kernel, job.layers, f, l0);
      return {
        frequencyHz: f,
        coilInAir: { inductanceH: p.inductanceInAirH, reactanceOhm: p.reactanceInAirOhm },
        deltaZ: { resistanceOhm: p.deltaResistanceOhm, reactanceOhm: p.deltaReactanceOhm },
        overConductor: {
          inductanceH: p.inductanceOverConductorH,
          resistanceOhm: p.resistanceOverConductorOhm,
        },
        normalized: { resistance: p.normalizedResistance, reactance: p.normalizedReactance },
      };
    }),
    warnings: [] as EstimateWarning[],
  };
}

function apparentConductivity(job: SensorJob, deadline: number) {
  const kernel = kernelFor(job.coil, job.liftOffM);
  const points = apparentConductivitySweep(kernel, job.layers, job.frequenciesHz, { deadline });
  const warnings = apparentConductivityWarnings(job.layers, points);
  return {
    points: points.map((p) => ({
      frequencyHz: p.frequencyHz,
      apparentConductivitySPerM: p.apparentConductivitySPerM,
      apparentPercentIacs: percentIacs(p.apparentConductivitySPerM),
      fitResidual: p.fitResidual,
    })),
    limits: conductivityLimits(job.layers),
    warnings,
  };
}

function launch(job: LaunchJob, deadline: number) {
  const result = simulateLaunch({ ...job.input, deadline });
  const { energy } = result;
  return {
    peakCurrentA: result.peakCurrentA,
    peakCurrentTimeS: result.peakCurrentTimeS,
    peakForceN: result.peakForceN,
    i2tA2s: result.i2tA2s,
    impulseNs: result.impulseNs,
    exitSpeedMPerS: result.exitSpeedMPerS,
    heightM: result.heightM,
    rangeM: result.rangeM,
    efficiency: result.efficiency,
    massKg: result.massKg,
    coilInductanceH: result.coilInductanceH,
    circuitResistanceOhm: result.circuitResistanceOhm,
    coil: result.coil,
    ...(result.core ? { core: result.core } : {}),
    energy: {
      storedJ: energy.storedJ,
      coilLossJ: energy.coilLossJ,
      blankLossJ: energy.blankLossJ,
      kineticJ: energy.kineticJ,
      residualJ: energy.residualJ,
      imbalanceJ: energy.imbalanceJ,
    },
    series: result.series,
    warnings: result.warnings,
  };
}

/** Runs one job to completion (or to its deadline) and shapes the answer as openapi.yaml says. */
export function runEstimateJob(job: EstimateJob): EstimateOutcome {
  const deadline = performance.now() + job.computeLimitMs;
  try {
    if (job.kind === 'checks') return { ok: true, value: runEngineChecks() };
    if (job.kind === 'launch') return { ok: true, value: launch(job, deadline) };
    if (job.kind === 'sort-plan')
      return { ok: true, value: evaluateSortPlan(job.input, { deadline, kernelFor }) };
    if (job.kind === 'impedance') return { ok: true, value: impedancePoints(job, deadline) };
    return { ok: true, value: apparentConductivity(job, deadline) };
  } catch (error) {
    if (error instanceof ComputeTimeExceededError)
      return { ok: false, kind: 'too-slow', message: error.message };
    // shared/physics/errors.ts: an input outside the range where the model holds, with its field.
    const e = error as { name?: string; field?: unknown; message?: string };
    if (e?.name === 'OutsideModelError')
      return {
        ok: false,
        kind: 'outside-model',
        field: typeof e.field === 'string' ? e.field : '/body',
        message: e.message ?? 'outside the range where the model holds',
      };
    throw error;
  }
}
