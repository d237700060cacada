/// <reference lib="webworker" />
import {
  apparentConductivitySweep,
  conductivityLimits,
} from '../../../../shared/physics/apparent-conductivity';
import { buildDoddDeedsKernel } from '../../../../shared/physics/dodd-deeds';
import { simulateLaunch } from '../../../../shared/physics/launch';
import { apparentConductivityWarnings } from '../../../../shared/physics/sensor-warnings';
import { frequencyForSkinDepth } from '../../../../shared/physics/skin-depth';
import {
  stackConductivityOverDensity,
  stackDensity,
  stackMass,
  stackMeanConductivity,
} from '../../../../shared/physics/stack';
import type { BlankResult, CompareMessage, CompareRequest } from './protocol';

/**
 * Runs the comparison off the page's thread: one Dodd–Deeds kernel for the sensor coil, an
 * apparent-conductivity sweep per blank and one launch per blank, reporting progress as it goes.
 */
const post = (message: CompareMessage) => self.postMessage(message);
const LAUNCH_WEIGHT = 40; // a launch costs about as much as forty sweep points

self.onmessage = (event: MessageEvent<CompareRequest>) => {
  const request = event.data;
  const started = performance.now();
  try {
    const kernel = buildDoddDeedsKernel(request.sensor.coil, request.sensor.liftOffM);
    const perBlank = request.frequenciesHz.length + LAUNCH_WEIGHT;
    const total = request.blanks.length * perBlank;
    const results: BlankResult[] = request.blanks.map(({ id, name, stack }, b) => {
      const layers = stack.layers.map((l) => ({
        conductivitySPerM: l.conductivitySPerM,
        relativePermeability: l.relativePermeability,
        thicknessM: l.thicknessM,
      }));
      const points = apparentConductivitySweep(kernel, layers, request.frequenciesHz, {
        onProgress: (f) =>
          post({
            type: 'progress',
            fraction: (b * perBlank + f * request.frequenciesHz.length) / total,
          }),
      });
      const face = stack.layers[0]!;
      let launchHeightM: number | null = null;
      let launchWarning: string | null;
      try {
        const launch = simulateLaunch({ ...request.launch, blank: stack, launchAngleDeg: 90 });
        launchHeightM = launch.heightM;
        launchWarning = launch.warnings[0]?.message ?? null;
      } catch (error) {
        launchWarning = error instanceof Error ? error.message : String(error);
      }
      post({ type: 'progress', fraction: ((b + 1) * perBlank) / total });
      return {
        id,
        name,
        points,
        limits: conductivityLimits(layers),
        faceDepthFrequencyHz:
          stack.layers.length > 1
            ? frequencyForSkinDepth(
                face.thicknessM,
                face.conductivitySPerM,
                face.relativePermeability,
              )
            : null,
        massKg: stackMass(stack),
        densityKgPerM3: stackDensity(stack),
        meanConductivitySPerM: stackMeanConductivity(stack),
        conductivityOverDensity: stackConductivityOverDensity(stack),
        launchHeightM,
        launchWarning,
        warnings: apparentConductivityWarnings(layers, points),
      };
    });
    post({ type: 'done', results, elapsedMs: performance.now() - started });
  } catch (error) {
    post({ type: 'error', message: error instanceof Error ? error.message : String(error) });
  }
};
