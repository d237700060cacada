import { Router } from 'express';
import {
  apparentConductivitySweep,
  ComputeTimeExceededError,
  conductivityLimits,
} from '../../shared/physics/apparent-conductivity';
import { impedanceAt, coilInAirInductance } from '../../shared/physics/dodd-deeds';
import { simulateLaunch } from '../../shared/physics/launch';
import { skinDepth } from '../../shared/physics/skin-depth';
import { percentIacs } from '../../shared/units/conductivity';
import type { Quantity } from '../../shared/units/quantity';
import { ProblemError } from '../http/problem';
import { siFromRequest } from '../http/quantity';
import type { CatalogueStore } from '../services/catalogue-store';
import {
  blankLayersFromRequest,
  coilFromRequest,
  frequenciesFromRequest,
  resolveMaterial,
  sensorLayersFromRequest,
  wireFromRequest,
  type CoilInput,
  type LayerInput,
  type MaterialInput,
} from '../services/estimate-inputs';
import { kernelFor } from '../services/kernel-cache';

/** Wall-clock budget of one calculation; beyond it the answer is a 422, not a hung request. */
export const COMPUTE_LIMIT_MS = 5000;

interface SensorBody {
  coil: CoilInput;
  liftOff: Quantity;
  layers: LayerInput[];
  frequencies: Quantity[];
}

interface LaunchBody {
  bank: { capacitance: Quantity; voltage: Quantity; seriesResistance: Quantity };
  coil: CoilInput;
  blank: { diameter: Quantity; layers: Array<{ material: MaterialInput; thickness: Quantity }> };
  gap: Quantity;
  launchAngleDeg?: number;
  filaments?: {
    coilRadial?: number;
    coilAxial?: number;
    blankRadial?: number;
    blankPerLayer?: number;
  };
}

/** Runs a calculation and turns a blown compute budget into a 422 problem. */
function withinBudget<T>(work: (deadline: number) => T): T {
  try {
    return work(performance.now() + COMPUTE_LIMIT_MS);
  } catch (error) {
    if (error instanceof ComputeTimeExceededError)
      throw new ProblemError(422, 'Unprocessable content', error.message);
    throw error;
  }
}

export function estimatesRouter(catalogue: CatalogueStore): Router {
  const router = Router();

  router.post('/estimates/skin-depth', async (req, res) => {
    const body = req.body as { material: MaterialInput; frequencies: Quantity[] };
    const m = resolveMaterial(body.material, '/body/material', await catalogue.get());
    const frequencies = frequenciesFromRequest(body.frequencies, '/body/frequencies');
    res.json({
      points: frequencies.map((frequencyHz) => ({
        frequencyHz,
        skinDepthM: skinDepth(frequencyHz, m.conductivitySPerM, m.relativePermeability),
      })),
    });
  });

  const sensorInputs = async (body: SensorBody) => {
    const table = await catalogue.get();
    const coil = coilFromRequest(body.coil, '/body/coil');
    return {
      kernel: kernelFor(coil, siFromRequest('length', body.liftOff, '/body/liftOff')),
      layers: sensorLayersFromRequest(body.layers, '/body/layers', table),
      frequencies: frequenciesFromRequest(body.frequencies, '/body/frequencies'),
    };
  };

  router.post('/estimates/impedance', async (req, res) => {
    const { kernel, layers, frequencies } = await sensorInputs(req.body as SensorBody);
    const l0 = coilInAirInductance(kernel);
    const points = withinBudget((deadline) =>
      frequencies.map((f) => {
        if (performance.now() > deadline) throw new ComputeTimeExceededError();
        const p = impedanceAt(kernel, layers, f, l0);
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
    );
    res.json({ points });
  });

  router.post('/estimates/apparent-conductivity', async (req, res) => {
    const { kernel, layers, frequencies } = await sensorInputs(req.body as SensorBody);
    const points = withinBudget((deadline) =>
      apparentConductivitySweep(kernel, layers, frequencies, { deadline }),
    );
    res.json({
      points: points.map((p) => ({
        frequencyHz: p.frequencyHz,
        apparentConductivitySPerM: p.apparentConductivitySPerM,
        apparentPercentIacs: percentIacs(p.apparentConductivitySPerM),
        fitResidual: p.fitResidual,
      })),
      limits: conductivityLimits(layers),
    });
  });

  router.post('/estimates/launch', async (req, res) => {
    const body = req.body as LaunchBody;
    const table = await catalogue.get();
    const geometry = coilFromRequest(body.coil, '/body/coil');
    const wire = wireFromRequest(body.coil, geometry, '/body/coil', table);
    const result = withinBudget((deadline) =>
      simulateLaunch({
        bank: {
          capacitanceF: siFromRequest(
            'capacitance',
            body.bank.capacitance,
            '/body/bank/capacitance',
          ),
          voltageV: siFromRequest('voltage', body.bank.voltage, '/body/bank/voltage'),
          seriesResistanceOhm: siFromRequest(
            'resistance',
            body.bank.seriesResistance,
            '/body/bank/seriesResistance',
          ),
        },
        coil: { ...geometry, ...wire },
        blank: {
          diameterM: siFromRequest('length', body.blank.diameter, '/body/blank/diameter'),
          layers: blankLayersFromRequest(body.blank.layers, '/body/blank/layers', table),
        },
        gapM: siFromRequest('length', body.gap, '/body/gap'),
        launchAngleDeg: body.launchAngleDeg ?? 90,
        filaments: body.filaments,
        deadline,
      }),
    );
    const { energy } = result;
    res.json({
      peakCurrentA: result.peakCurrentA,
      peakCurrentTimeS: result.peakCurrentTimeS,
      peakForceN: result.peakForceN,
      impulseNs: result.impulseNs,
      exitSpeedMPerS: result.exitSpeedMPerS,
      heightM: result.heightM,
      rangeM: result.rangeM,
      efficiency: result.efficiency,
      massKg: result.massKg,
      coilInductanceH: result.coilInductanceH,
      circuitResistanceOhm: result.circuitResistanceOhm,
      energy: {
        storedJ: energy.storedJ,
        coilLossJ: energy.coilLossJ,
        blankLossJ: energy.blankLossJ,
        kineticJ: energy.kineticJ,
        residualJ: energy.residualJ,
      },
      series: result.series,
      warnings: result.warnings,
    });
  });

  return router;
}
