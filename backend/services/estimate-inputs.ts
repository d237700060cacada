import { valueOf } from '../../shared/catalogue/alloy-record';
import { awgDiameter } from '../../shared/physics/awg';
import type { CoilGeometry } from '../../shared/physics/coil';
import type { ConductorLayer } from '../../shared/physics/dodd-deeds';
import type { StackLayer } from '../../shared/physics/stack';
import { IACS_100_S_PER_M } from '../../shared/units/conductivity';
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
  return {
    conductivitySPerM: siFromRequest('conductivity', material.conductivity, `${path}/conductivity`),
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
  return {
    innerRadiusM,
    outerRadiusM,
    lengthM: siFromRequest('length', coil.length, `${path}/length`),
    turns: coil.turns,
  };
}

/**
 * The drive coil's wire: a diameter, an AWG (ASTM B258), or, given neither, the diameter that
 * fills the winding section in square packing. The conductor defaults to annealed copper.
 */
export function wireFromRequest(
  coil: CoilInput,
  geometry: CoilGeometry,
  path: string,
  catalogue: Catalogue,
) {
  if (coil.wireDiameter && coil.awg !== undefined)
    throw invalid(`${path}/awg`, 'give a wire diameter or an AWG, not both');
  const wireDiameterM = coil.wireDiameter
    ? siFromRequest('length', coil.wireDiameter, `${path}/wireDiameter`)
    : coil.awg !== undefined
      ? awgDiameter(coil.awg)
      : Math.sqrt(
          ((geometry.outerRadiusM - geometry.innerRadiusM) * geometry.lengthM) / geometry.turns,
        );
  const conductorSPerM = coil.conductor
    ? resolveMaterial(coil.conductor, `${path}/conductor`, catalogue).conductivitySPerM
    : IACS_100_S_PER_M;
  return { wireDiameterM, conductorSPerM };
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
      thicknessM: siFromRequest('length', layer.thickness, `${path}/${i}/thickness`),
    };
  });
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
      thicknessM: siFromRequest('length', layer.thickness, `${path}/${i}/thickness`),
    };
  });
}

export function frequenciesFromRequest(frequencies: Quantity[], path: string): number[] {
  return frequencies.map((f, i) => siFromRequest('frequency', f, `${path}/${i}`));
}
