import type {
  ApparentConductivityPoint,
  ConductivityLimits,
} from '../../../../shared/physics/apparent-conductivity';
import type { CoilGeometry } from '../../../../shared/physics/coil';
import type { CapacitorBank, DriveCoil } from '../../../../shared/physics/launch';
import type { Stack } from '../../../../shared/physics/stack';
import type { EstimateWarning } from '../../../../shared/physics/warnings';

/** What the page asks the comparison worker, all SI. */
export interface CompareRequest {
  blanks: Array<{ id: string; name: string; stack: Stack }>;
  sensor: { coil: CoilGeometry; liftOffM: number };
  frequenciesHz: number[];
  launch: { bank: CapacitorBank; coil: DriveCoil; gapM: number };
}

export interface BlankResult {
  id: string;
  name: string;
  points: ApparentConductivityPoint[];
  limits: ConductivityLimits;
  /** Where the standard depth in the face layer equals its thickness (plated or clad blanks). */
  faceDepthFrequencyHz: number | null;
  massKg: number;
  densityKgPerM3: number;
  meanConductivitySPerM: number;
  conductivityOverDensity: number;
  launchHeightM: number | null;
  launchWarning: string | null;
  /** What the sweep must not be read without (a magnetic layer). */
  warnings: EstimateWarning[];
}

export type CompareMessage =
  | { type: 'progress'; fraction: number }
  | { type: 'done'; results: BlankResult[]; elapsedMs: number }
  | { type: 'error'; message: string };
