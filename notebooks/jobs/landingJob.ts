// Job: one landing trial, step by step, through runTrial's onStep rows; the carrier's own
// position and heading from the world model at the same times (for the top view), and the
// chi-square acceptance interval of the trial's mean NIS. Rows are kept every `every` seconds
// for the plots; every detector box, every camera update (status, NIS) and every true outline
// of a captured frame is kept.
import type { Box } from '../../estimator/camera/Box.js';
import type { UpdateStatus } from '../../estimator/models/LandingFilter.js';
import type { Scenario } from '../../estimator/sim/Scenario.js';
import type { Phase, TrialResult } from '../../estimator/sim/TrialResult.js';
import { runTrial, type TraceRow } from '../../estimator/sim/runTrial.js';
import { createCarrierState, createCarrierTrajectory } from '../../estimator/sim/world/carrierPath.js';
import { averagedChiSquareInterval } from '../../estimator/stats/chiSquare.js';
import type { Progress } from './JobState.js';

export interface LandingInput {
  scenario: Scenario;
  seed: number;
  trial: number;
  /** Sweep point the trial belongs to (its streams derive from it); default 0, a lone trial. */
  point?: number;
  /** Spacing of kept rows (s). */
  every: number;
}

type Columns = [number[], number[], number[]];

export interface LandingOutput {
  result: TrialResult;
  t: number[];
  phase: Phase[];
  /** r = p_carrier - p_lander (ENU, m): truth, estimate (NaN before the filter starts) and 1-sigma. */
  truth: Columns;
  estimate: Columns;
  sigma: Columns;
  /** Carrier deck centre east/north (m) and heading (rad). */
  carrierEast: number[];
  carrierNorth: number[];
  carrierHeading: number[];
  /** Boxes at the step they reached the filter. */
  boxes: { t: number; box: Box }[];
  /** Camera updates: status ('gated' = refused by the gate), NIS (NaN if undefined) and its dimension. */
  updates: { t: number; status: UpdateStatus; nis: number; dim: number }[];
  /** Noise-free box of the carrier's true outline, per captured frame (at its capture time). */
  outlines: { t: number; box: Box }[];
  /** Acceptance interval of the mean NIS over the trial's accepted box updates (95 %), or null. */
  nisBounds: [number, number] | null;
}

const columns = (): Columns => [[], [], []];

export function landingJob(input: LandingInput, progress: Progress<LandingOutput>): LandingOutput {
  const trajectory = createCarrierTrajectory(input.scenario.carrier, input.scenario.carrier.path.points);
  const carrier = createCarrierState();
  const out: Omit<LandingOutput, 'result' | 'nisBounds'> = {
    t: [], phase: [], truth: columns(), estimate: columns(), sigma: columns(), carrierEast: [], carrierNorth: [], carrierHeading: [], boxes: [], updates: [], outlines: [],
  };
  let next = -Infinity;
  progress(0, 1, null);
  const result = runTrial(input.scenario, {
    key: { seed: input.seed, point: input.point ?? 0, trial: input.trial },
    onStep: (row: TraceRow) => {
      if (row.box) out.boxes.push({ t: row.t, box: row.box });
      for (const u of row.updates) out.updates.push({ t: row.t, status: u.status, nis: u.nis, dim: u.dim });
      if (row.outline) out.outlines.push({ t: row.t, box: row.outline });
      if (row.t < next) return;
      next = row.t + input.every;
      out.t.push(row.t);
      out.phase.push(row.phase);
      for (let i = 0; i < 3; i++) {
        out.truth[i]!.push(row.truth.r[i]!);
        out.estimate[i]!.push(row.estimate ? row.estimate.r[i]! : NaN);
        out.sigma[i]!.push(row.sigma ? row.sigma.r[i]! : NaN);
      }
      trajectory.stateAt(row.t, carrier);
      out.carrierEast.push(carrier.position[0]!);
      out.carrierNorth.push(carrier.position[1]!);
      out.carrierHeading.push(carrier.heading);
    },
  });
  progress(1, 1, null);
  const nisBounds = result.nisCount > 0 && result.nisDim > 0 ? averagedChiSquareInterval(result.nisCount, result.nisDim) : null;
  return { ...out, result, nisBounds };
}
