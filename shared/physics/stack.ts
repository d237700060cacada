/** A blank: a disc of layers from the face toward the coil downward. SI throughout. */
export interface StackLayer {
  conductivitySPerM: number;
  relativePermeability: number;
  densityKgPerM3: number;
  thicknessM: number;
}

export interface Stack {
  diameterM: number;
  layers: StackLayer[];
}

/** Mass of the blank, kg: Σ ρ·t·πD²/4. */
export function stackMass(stack: Stack): number {
  const area = (Math.PI * stack.diameterM ** 2) / 4;
  return stack.layers.reduce((m, l) => m + l.densityKgPerM3 * l.thicknessM * area, 0);
}

export function stackThickness(stack: Stack): number {
  return stack.layers.reduce((t, l) => t + l.thicknessM, 0);
}

/** Mean density, kg/m³: mass over volume. */
export function stackDensity(stack: Stack): number {
  return stackMass(stack) / (((Math.PI * stack.diameterM ** 2) / 4) * stackThickness(stack));
}

/** Thickness-weighted mean conductivity, S/m. */
export function stackMeanConductivity(stack: Stack): number {
  return (
    stack.layers.reduce((s, l) => s + l.conductivitySPerM * l.thicknessM, 0) / stackThickness(stack)
  );
}

/**
 * The eddy-current separation figure of merit σ/ρ of the blank as a whole, S·m²/kg (mean
 * conductivity over mean density; Schlömann 1975 for particles small against the skin depth).
 */
export function stackConductivityOverDensity(stack: Stack): number {
  return stackMeanConductivity(stack) / stackDensity(stack);
}

/** The layers for a core plated on both faces: plating, core, plating. */
export function platedOnBothFaces(core: StackLayer, plating: StackLayer): StackLayer[] {
  return [plating, core, plating];
}
