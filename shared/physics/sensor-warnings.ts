import type { ApparentConductivityPoint } from './apparent-conductivity';
import type { ConductorLayer } from './dodd-deeds';
import { MAGNETIC_FROM_MU_R, type EstimateWarning } from './warnings';

/**
 * The warnings of an apparent-conductivity sweep: a magnetic layer makes the reading on a
 * non-magnetic calibration meaningless, and the fit residual says by how much. Shared by the API's
 * worker pool and Layer Lab's browser worker so that both say the same thing.
 */
export function apparentConductivityWarnings(
  layers: ConductorLayer[],
  points: Pick<ApparentConductivityPoint, 'fitResidual'>[],
): EstimateWarning[] {
  const muR = Math.max(...layers.map((l) => l.relativePermeability));
  if (!(muR > MAGNETIC_FROM_MU_R)) return [];
  const worst = Math.max(...points.map((p) => p.fitResidual));
  return [
    {
      code: 'magnetic-layer',
      message: `A layer is magnetic (µr up to ${Number(muR.toPrecision(3))}): an apparent conductivity read against non-magnetic calibration blocks is not meaningful here. The nearest homogeneous non-magnetic plate misses the stack's normalised impedance by up to ${Number((worst * 100).toPrecision(2))} % (fitResidual ${Number(worst.toPrecision(2))}), and the readings need not approach the limits given.`,
    },
  ];
}
