import { Router } from 'express';
import { chargeTime } from '../../shared/physics/bank';
import { skinDepth } from '../../shared/physics/skin-depth';
import { MAGNETIC_FROM_MU_R, type EstimateWarning } from '../../shared/physics/warnings';
import type { Quantity } from '../../shared/units/quantity';
import type { EstimatePool } from '../estimates/pool';
import { siFromRequest } from '../http/quantity';
import type { CatalogueStore } from '../services/catalogue-store';
import {
  blankLayersFromRequest,
  coilFromRequest,
  coreFromRequest,
  frequenciesFromRequest,
  resolveMaterial,
  sensorLayersFromRequest,
  supplyPowerFromRequest,
  switchFromRequest,
  wireFromRequest,
  type CoilInput,
  type CoreInput,
  type SwitchInput,
  type LayerInput,
  type MaterialInput,
} from '../services/estimate-inputs';

interface SensorBody {
  coil: CoilInput;
  liftOff: Quantity;
  layers: LayerInput[];
  frequencies: Quantity[];
}

interface LaunchBody {
  bank: {
    capacitance: Quantity;
    voltage: Quantity;
    seriesResistance: Quantity;
    ratedVoltage?: Quantity;
    supplyPower?: Quantity;
  };
  switch?: SwitchInput;
  coil: CoilInput & { core?: CoreInput };
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

/**
 * The calculators. Inputs are read and checked here, on the event loop (cheap: units and table
 * look-ups); the numerical work goes to the worker pool, which enforces the compute limit.
 */
export function estimatesRouter(catalogue: CatalogueStore, pool: EstimatePool): Router {
  const router = Router({ caseSensitive: true, strict: true });

  // A few multiplications per frequency: not worth a trip to a thread.
  router.post('/estimates/skin-depth', async (req, res) => {
    const body = req.body as { material: MaterialInput; frequencies: Quantity[] };
    const m = resolveMaterial(body.material, '/body/material', await catalogue.get());
    const frequencies = frequenciesFromRequest(body.frequencies, '/body/frequencies');
    const warnings: EstimateWarning[] =
      m.relativePermeability > MAGNETIC_FROM_MU_R
        ? [
            {
              code: 'magnetic-layer',
              message: `The material is magnetic: the depth uses µr = ${Number(m.relativePermeability.toPrecision(3))}, a typical initial permeability. A ferromagnetic part's µr varies with field, frequency, temper and stress by an order of magnitude, and the depth with its square root.`,
            },
          ]
        : [];
    res.json({
      points: frequencies.map((frequencyHz) => ({
        frequencyHz,
        skinDepthM: skinDepth(frequencyHz, m.conductivitySPerM, m.relativePermeability),
      })),
      warnings,
    });
  });

  const sensorJob = async (kind: 'impedance' | 'apparent-conductivity', body: SensorBody) => {
    const table = await catalogue.get();
    return {
      kind,
      coil: coilFromRequest(body.coil, '/body/coil'),
      liftOffM: siFromRequest('length', body.liftOff, '/body/liftOff'),
      layers: sensorLayersFromRequest(body.layers, '/body/layers', table),
      frequenciesHz: frequenciesFromRequest(body.frequencies, '/body/frequencies'),
    };
  };

  router.post('/estimates/impedance', async (req, res) => {
    res.json(await pool.run(await sensorJob('impedance', req.body as SensorBody)));
  });

  router.post('/estimates/apparent-conductivity', async (req, res) => {
    res.json(await pool.run(await sensorJob('apparent-conductivity', req.body as SensorBody)));
  });

  router.post('/estimates/launch', async (req, res) => {
    const body = req.body as LaunchBody;
    const table = await catalogue.get();
    const geometry = coilFromRequest(body.coil, '/body/coil');
    const wire = wireFromRequest(body.coil, geometry, '/body/coil', table);
    const input = {
      bank: {
        capacitanceF: siFromRequest('capacitance', body.bank.capacitance, '/body/bank/capacitance'),
        voltageV: siFromRequest('voltage', body.bank.voltage, '/body/bank/voltage'),
        seriesResistanceOhm: siFromRequest(
          'resistance',
          body.bank.seriesResistance,
          '/body/bank/seriesResistance',
        ),
        ratedVoltageV: body.bank.ratedVoltage
          ? siFromRequest('voltage', body.bank.ratedVoltage, '/body/bank/ratedVoltage')
          : undefined,
      },
      switchRating: body.switch ? switchFromRequest(body.switch, '/body/switch') : undefined,
      coil: {
        ...geometry,
        ...wire,
        ...(body.coil.core ? { core: coreFromRequest(body.coil.core, '/body/coil/core') } : {}),
      },
      blank: {
        diameterM: siFromRequest('length', body.blank.diameter, '/body/blank/diameter'),
        layers: blankLayersFromRequest(body.blank.layers, '/body/blank/layers', table),
      },
      gapM: siFromRequest('length', body.gap, '/body/gap'),
      launchAngleDeg: body.launchAngleDeg ?? 90,
      filaments: body.filaments,
    };
    const result = (await pool.run({ kind: 'launch', input })) as { energy: { storedJ: number } };
    const supplyPowerW = body.bank.supplyPower
      ? supplyPowerFromRequest(body.bank.supplyPower, '/body/bank/supplyPower')
      : undefined;
    res.json(
      supplyPowerW === undefined
        ? result
        : { ...result, chargeTimeS: chargeTime(result.energy.storedJ, supplyPowerW) },
    );
  });

  return router;
}
