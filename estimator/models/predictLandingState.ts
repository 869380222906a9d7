// The state (mean) part of the landing predict, x ← f(x, u) for one step (see predictLanding.ts
// for the model); shared by the loop predict and the generated straight-line ones. In place.
import type { ProcessCoefficients } from './ProcessCoefficients.js';
import { STANDARD_GRAVITY } from './landingState.js';

export function predictLandingState(x: Float64Array, f: ArrayLike<number>, Rwb: Float64Array, c: ProcessCoefficients): void {
  const dt = c.dt, h2 = 0.5 * dt * dt;
  const f0 = f[0]! - x[9]!, f1 = f[1]! - x[10]!, f2 = f[2]! - x[11]!;
  const a0 = Rwb[0]! * f0 + Rwb[1]! * f1 + Rwb[2]! * f2;
  const a1 = Rwb[3]! * f0 + Rwb[4]! * f1 + Rwb[5]! * f2;
  const a2 = Rwb[6]! * f0 + Rwb[7]! * f1 + Rwb[8]! * f2 - STANDARD_GRAVITY;
  x[0] = x[0]! + dt * (x[3]! - x[6]!) - h2 * a0;
  x[1] = x[1]! + dt * (x[4]! - x[7]!) - h2 * a1;
  x[2] = x[2]! + dt * (x[5]! - x[8]!) - h2 * a2;
  x[6] = x[6]! + dt * a0;
  x[7] = x[7]! + dt * a1;
  x[8] = x[8]! + dt * a2;
  if (c.singer) {
    for (let i = 0; i < 3; i++) {
      x[i] = x[i]! + c.alpha * x[12 + i]!;
      x[3 + i] = x[3 + i]! + c.beta * x[12 + i]!;
      x[12 + i] = c.e * x[12 + i]!;
    }
  }
}
