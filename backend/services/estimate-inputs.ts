import { valueOf } from '../../shared/catalogue/alloy-record';
import { awgDiameter } from '../../shared/physics/awg';
import { OutsideModelError } from '../../shared/physics/errors';
import {
  bareDiameterFor,
  COPPER_DENSITY_KG_PER_M3,
  fillFactor,
  heavyBuildDiameter,
  MAX_FILL,
  windowArea,
  windowNeeded,
} from '../../shared/physics/winding';
import type { CoilGeometry } from '../../shared/physics/coil';
import type { ConductorLayer } from '../../shared/physics/dodd-deeds';
import type { StackLayer } from '../../shared/physics/stack';
import { IACS_100_S_PER_M } from '../../shared/units/conductivity';
import { InvalidQuantityError, UnknownUnitError } from '../../shared/units/errors';
import {
  toAmpereSquaredSeconds,
  toAmperes,
  toTeslas,
  toWatts,
} from '../../shared/units/pulse-ratings';
import type { Quantity } from '../../shared/units/quantity';
import { siFromRequest } from '../http/quantity';
import { ProblemError } from '../http/problem';
import type { Catalogue } from './catalogue';

/** Request shapes as openapi.yaml defines them (already validated there). */
export type MaterialInput =
  { alloy: string } | { conductivity: Quantity; relativePermeability?: number; density?: Quantity };
export type LayerInput =
  { material: MaterialInput; thickness: Quantity } | { material: MaterialInput; halfSpace: true };
export interface CoilInput {
  innerRadius: Quantity;
  outerRadius: Quantity;
  length: Quantity;
  turns: number;
  wireDiameter?: Quantity;
  awg?: number;
  conductor?: MaterialInput;
}

export interface ResolvedMaterial {
  conductivitySPerM: number;
  relativePermeability: number;
  densityKgPerM3: number | null;
}

const invalid = (path: string, message: string) =>
  new ProblemError(400, 'Bad request', `${path}: ${message}`, [{ path, message }]);

/**
 * Smallest coil, wire and blank dimension the models take, m. Both treat a winding as a
 * continuum of turns and a blank as bulk metal; no coil or blank is made below a micrometre
 * (thin-film coils, the smallest, are tens of micrometres across: common practice, no source).
 * Far below it the arithmetic fails too: the Dodd–Deeds scale πµ0N²/[h²(r2 − r1)²] divides by a
 * square that underflows to zero, and a wire's cross-section with it.
 */
export const MIN_DIMENSION_M = 1e-6;
/**
 * Thinnest layer, m: a nanometre is a few atoms, far below the tens of nanometres under which a
 * metal film stops having its bulk conductivity (Fuchs–Sondheimer size effect); the models take
 * any layer at its bulk σ, so a flash plating is already at their edge.
 */
export const MIN_LAYER_M = 1e-9;

/**
 * Highest conductivity the models take, S/m. The best normal metals reach about 1e11–1e12 S/m
 * only as very pure crystals a few kelvin above absolute zero (copper and aluminium of residual
 * resistance ratio in the tens of thousands; figures recalled, not re-checked); beyond is a
 * superconductor, which no eddy-current model here describes. A tiny resistivity (1e-300 Ω·m)
 * gives σ near the largest double, where the layer recursion overflows.
 */
export const MAX_CONDUCTIVITY_S_PER_M = 1e12;

const um = (m: number) => `${Number((m * 1e6).toPrecision(3))} µm`;

function atLeast(valueM: number, minM: number, path: string, what: string): number {
  if (!(valueM >= minM))
    throw new OutsideModelError(
      path,
      `${what} is ${um(valueM)}, below the ${um(minM)} these models hold for`,
    );
  return valueM;
}

/** An alloy of the table (nominal values) or a material given by its conductivity. */
export function resolveMaterial(
  material: MaterialInput,
  path: string,
  catalogue: Catalogue,
): ResolvedMaterial {
  if ('alloy' in material) {
    const found = catalogue.find(material.alloy);
    if (!found) throw invalid(`${path}/alloy`, `no alloy '${material.alloy}' in the table`);
    return {
      conductivitySPerM: found.item.conductivitySPerM,
      relativePermeability: found.record.relativePermeability,
      densityKgPerM3: valueOf(found.record, 'density')?.nominal ?? null,
    };
  }
  const conductivitySPerM = siFromRequest(
    'conductivity',
    material.conductivity,
    `${path}/conductivity`,
  );
  if (conductivitySPerM > MAX_CONDUCTIVITY_S_PER_M)
    throw new OutsideModelError(
      `${path}/conductivity`,
      `a conductivity of ${Number(conductivitySPerM.toPrecision(3))} S/m is above the ${MAX_CONDUCTIVITY_S_PER_M} S/m of the best metal at a few kelvin: these models describe no superconductor`,
    );
  return {
    conductivitySPerM,
    relativePermeability: material.relativePermeability ?? 1,
    densityKgPerM3: material.density
      ? siFromRequest('density', material.density, `${path}/density`)
      : null,
  };
}

export function coilFromRequest(coil: CoilInput, path: string): CoilGeometry {
  const innerRadiusM = siFromRequest('length', coil.innerRadius, `${path}/innerRadius`);
  const outerRadiusM = siFromRequest('length', coil.outerRadius, `${path}/outerRadius`);
  if (outerRadiusM <= innerRadiusM)
    throw invalid(`${path}/outerRadius`, 'the outer radius must be larger than the inner radius');
  atLeast(outerRadiusM, MIN_DIMENSION_M, `${path}/outerRadius`, "the coil's outer radius");
  return {
    innerRadiusM,
    outerRadiusM,
    lengthM: atLeast(
      siFromRequest('length', coil.length, `${path}/length`),
      MIN_DIMENSION_M,
      `${path}/length`,
      "the coil's length",
    ),
    turns: coil.turns,
  };
}

const mm2 = (m2: number) => `${Number((m2 * 1e6).toPrecision(3))} mm²`;
const mmText = (m: number) => `${Number((m * 1e3).toPrecision(3))} mm`;

/**
 * The drive coil's wire: a bare diameter, an AWG (ASTM B258), or, given neither, the wire whose
 * heavy-build overall diameter fills the winding section in square packing (layer winding). The
 * insulation is heavy-build magnet wire ({@link heavyBuildDiameter}); a coil whose turns do not
 * fit its window even at the densest packing ({@link MAX_FILL}) is refused with the numbers
 * (OutsideModelError on `path`, a 422). The conductor defaults to annealed copper.
 */
export function wireFromRequest(
  coil: CoilInput,
  geometry: CoilGeometry,
  path: string,
  catalogue: Catalogue,
) {
  if (coil.wireDiameter && coil.awg !== undefined)
    throw invalid(`${path}/awg`, 'give a wire diameter or an AWG, not both');
  let wireDiameterM: number;
  if (coil.wireDiameter)
    wireDiameterM = atLeast(
      siFromRequest('length', coil.wireDiameter, `${path}/wireDiameter`),
      MIN_DIMENSION_M,
      `${path}/wireDiameter`,
      "the wire's diameter",
    );
  else if (coil.awg !== undefined) wireDiameterM = awgDiameter(coil.awg);
  else
    wireDiameterM = atLeast(
      bareDiameterFor(Math.sqrt(windowArea(geometry) / geometry.turns)),
      MIN_DIMENSION_M,
      `${path}/turns`,
      'the wire that these turns leave room for in the winding section',
    );
  const overallDiameterM = heavyBuildDiameter(wireDiameterM);
  const fill = fillFactor(geometry, overallDiameterM);
  if (!(fill <= MAX_FILL)) {
    const wire = coil.awg !== undefined ? `AWG ${coil.awg}` : `${mmText(wireDiameterM)} wire`;
    throw new OutsideModelError(
      path,
      `${geometry.turns} turns of ${wire} (${mmText(overallDiameterM)} over heavy-build insulation) need ${mm2(windowNeeded(geometry.turns, overallDiameterM))} of window even wound orthocyclically; this coil has ${mm2(windowArea(geometry))} (fill ${Number(fill.toPrecision(3))}, where no winding of round wire passes ${MAX_FILL.toFixed(3)})`,
    );
  }
  const conductor = coil.conductor
    ? resolveMaterial(coil.conductor, `${path}/conductor`, catalogue)
    : undefined;
  return {
    wireDiameterM,
    overallDiameterM,
    conductorSPerM: conductor ? conductor.conductivitySPerM : IACS_100_S_PER_M,
    conductorDensityKgPerM3: conductor?.densityKgPerM3 ?? COPPER_DENSITY_KG_PER_M3,
  };
}

export function sensorLayersFromRequest(
  layers: LayerInput[],
  path: string,
  catalogue: Catalogue,
): ConductorLayer[] {
  return layers.map((layer, i) => {
    const m = resolveMaterial(layer.material, `${path}/${i}/material`, catalogue);
    if ('halfSpace' in layer) {
      if (i !== layers.length - 1)
        throw invalid(`${path}/${i}/halfSpace`, 'only the last layer can be a half-space');
      return {
        conductivitySPerM: m.conductivitySPerM,
        relativePermeability: m.relativePermeability,
        thicknessM: null,
      };
    }
    return {
      conductivitySPerM: m.conductivitySPerM,
      relativePermeability: m.relativePermeability,
      thicknessM: layerThickness(layer.thickness, `${path}/${i}/thickness`),
    };
  });
}

function layerThickness(thickness: Quantity, path: string): number {
  return atLeast(siFromRequest('length', thickness, path), MIN_LAYER_M, path, 'the layer');
}

export function blankLayersFromRequest(
  layers: Array<{ material: MaterialInput; thickness: Quantity }>,
  path: string,
  catalogue: Catalogue,
): StackLayer[] {
  return layers.map((layer, i) => {
    const m = resolveMaterial(layer.material, `${path}/${i}/material`, catalogue);
    if (m.densityKgPerM3 === null)
      throw invalid(
        `${path}/${i}/material/density`,
        'a blank layer needs a density to give the blank its mass',
      );
    return {
      conductivitySPerM: m.conductivitySPerM,
      relativePermeability: m.relativePermeability,
      densityKgPerM3: m.densityKgPerM3,
      thicknessM: layerThickness(layer.thickness, `${path}/${i}/thickness`),
    };
  });
}

export function frequenciesFromRequest(frequencies: Quantity[], path: string): number[] {
  return frequencies.map((f, i) => siFromRequest('frequency', f, `${path}/${i}`));
}

/** A switch's pulse ratings as the request gives them. */
export interface SwitchInput {
  surgeCurrentRating: Quantity;
  i2tRating: Quantity;
}

/** One rating in SI, or a 400 naming its unit or value (as siFromRequest does for the others). */
function rating(convert: (v: number, u: string) => number, q: Quantity, path: string): number {
  try {
    return convert(q.value, q.unit);
  } catch (error) {
    if (error instanceof UnknownUnitError) throw invalid(`${path}/unit`, error.message);
    if (error instanceof InvalidQuantityError) throw invalid(`${path}/value`, error.message);
    throw error;
  }
}

/** An iron core in the drive coil's bore, as the request gives it. */
export interface CoreInput {
  radius: Quantity;
  length: Quantity;
  relativePermeability: number;
  saturationFluxDensity: Quantity;
}

/** The core in SI; the engine checks it against the winding (radius within the bore). */
export function coreFromRequest(core: CoreInput, path: string) {
  return {
    radiusM: siFromRequest('length', core.radius, `${path}/radius`),
    lengthM: siFromRequest('length', core.length, `${path}/length`),
    relativePermeability: core.relativePermeability,
    saturationFluxDensityT: rating(
      toTeslas,
      core.saturationFluxDensity,
      `${path}/saturationFluxDensity`,
    ),
  };
}

/** The output power of the supply that charges the bank, W. */
export function supplyPowerFromRequest(power: Quantity, path: string): number {
  return rating(toWatts, power, path);
}

/** The switch's non-repetitive surge current (A) and I²t (A²s) ratings. */
export function switchFromRequest(sw: SwitchInput, path: string) {
  return {
    surgeCurrentA: rating(toAmperes, sw.surgeCurrentRating, `${path}/surgeCurrentRating`),
    i2tA2s: rating(toAmpereSquaredSeconds, sw.i2tRating, `${path}/i2tRating`),
  };
}
