// Horizontal guidance on the ESTIMATE: a law turns the estimated relative state into a
// horizontal velocity command for the lander. Allocation-free: commands are written into
// `out`. Saturation everywhere: acceleration, then speed (norm limits, direction kept).
import type { GuidanceSpec, LanderSpec } from './Scenario.js';
import { PidGuidance } from './guidancePid.js';
import { LqrGuidance } from './guidanceLqr.js';

export { limitNorm2, type HorizontalEstimate, type HorizontalGuidance } from './HorizontalGuidance.js';
import type { HorizontalGuidance } from './HorizontalGuidance.js';

/**
 * The law named by guidance.law, with the lander's limits for saturation.
 * @param dt guidance step (s), = 1 / filter.rate; LQR gains are computed for it.
 */
export function createGuidance(guidance: GuidanceSpec, lander: LanderSpec, dt: number): HorizontalGuidance {
  return guidance.law === 'lqr' ? new LqrGuidance(guidance, lander, dt) : new PidGuidance(guidance, lander);
}
