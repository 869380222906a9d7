// Landing-model predict, in place and allocation-free, exploiting the block structure of F:
//   a_L = R_wb (f - ba) + g
//   r  ← r + dt (vC - vL) - dt²/2 a_L + α aC      vC ← vC + β aC     aC ← e aC
//   vL ← vL + dt a_L                               ba ← ba
// F = F_s F_cv: F_cv has blocks I, dt I, -dt I, (dt²/2) R_wb (r by ba), -dt R_wb (vL by ba);
// the Singer factor F_s (identity without aC) adds α I (r by aC), β I (vC by aC), e I (aC).
// P⁺ = F P Fᵀ + Q in two passes over P, for the upper triangle only:
//   row pass     T = F P = F_s (F_cv P)      rows r and vL, then (Singer) r, vC, aC
//   column pass  P⁺ = T Fᵀ = (T F_cvᵀ) F_sᵀ  columns r (rows r) and vL (rows r, vC, vL), then
//                (Singer) r, vC, aC; rows vC and ba of F_cv are identity rows
// Every entry a pass writes is read from the previous stage only, so it works in place; the
// lower triangle is left stale by the passes, then Q is added and the upper triangle mirrored,
// so P stays exactly symmetric. Straight-line inner loops, no branches per entry (hot path:
// one call per IMU step plus one per re-propagated step of every delayed box).
// The deck-scale state s (last, n = 13 or 16) is a random constant: its row of F is a unit row and
// its column is zero off the diagonal, so P_ss is unchanged and the cross-covariance P_xs only
// needs the row pass (P_xs ← F P_xs), which the passes' loops over every column already do.
// predictLanding runs these passes unrolled into straight-line code generated from the loops
// below (predictLanding.generated.ts: bit-identical, about 1.4x faster); the loops are the
// reference and serve any other state size.
import type { ProcessCoefficients } from './ProcessCoefficients.js';
import { predictConstantVelocity, predictConstantVelocityDeckScale, predictConstantVelocityPointing, predictConstantVelocityPointingDeckScale, predictSinger, predictSingerDeckScale, predictSingerPointing, predictSingerPointingDeckScale } from './predictLanding.generated.js';
import { predictLandingState } from './predictLandingState.js';

/** Returns false when x or P became non-finite (NaN or ±Infinity anywhere). */
export function predictLanding(x: Float64Array, P: Float64Array, n: number, f: ArrayLike<number>, Rwb: Float64Array, c: ProcessCoefficients): boolean {
  if (!c.singer && n === 12) return predictConstantVelocity(x, P, f, Rwb, c);
  if (c.singer && n === 15) return predictSinger(x, P, f, Rwb, c);
  if (!c.singer && n === 13) return predictConstantVelocityDeckScale(x, P, f, Rwb, c);
  if (c.singer && n === 16) return predictSingerDeckScale(x, P, f, Rwb, c);
  // with the two pointing states (and s)
  if (!c.singer && n === 14) return predictConstantVelocityPointing(x, P, f, Rwb, c);
  if (!c.singer && n === 15) return predictConstantVelocityPointingDeckScale(x, P, f, Rwb, c);
  if (c.singer && n === 17) return predictSingerPointing(x, P, f, Rwb, c);
  if (c.singer && n === 18) return predictSingerPointingDeckScale(x, P, f, Rwb, c);
  return predictLandingLoops(x, P, n, f, Rwb, c);
}

/** predictLanding by the loops of this file, for any model. */
export function predictLandingLoops(x: Float64Array, P: Float64Array, n: number, f: ArrayLike<number>, Rwb: Float64Array, c: ProcessCoefficients): boolean {
  const dt = c.dt, h2 = 0.5 * dt * dt;
  const R00 = Rwb[0]!, R01 = Rwb[1]!, R02 = Rwb[2]!, R10 = Rwb[3]!, R11 = Rwb[4]!, R12 = Rwb[5]!, R20 = Rwb[6]!, R21 = Rwb[7]!, R22 = Rwb[8]!;
  predictLandingState(x, f, Rwb, c);
  const r1 = n, r2 = 2 * n, c0 = 3 * n, c1 = 4 * n, c2 = 5 * n, l0 = 6 * n, l1 = 7 * n, l2 = 8 * n, b0 = 9 * n, b1 = 10 * n, b2 = 11 * n;
  // Row pass, F_cv: T[r] = P[r] + dt (P[vC] - P[vL]) + h2 R_wb P[ba];  T[vL] = P[vL] - dt R_wb P[ba].
  // Row vL is needed from column vL on only (its earlier columns are lower triangle of P⁺).
  for (let k = 0; k < n; k++) {
    const pb0 = P[b0 + k]!, pb1 = P[b1 + k]!, pb2 = P[b2 + k]!;
    const y0 = R00 * pb0 + R01 * pb1 + R02 * pb2;
    const y1 = R10 * pb0 + R11 * pb1 + R12 * pb2;
    const y2 = R20 * pb0 + R21 * pb1 + R22 * pb2;
    P[k] = P[k]! + dt * (P[c0 + k]! - P[l0 + k]!) + h2 * y0;
    P[r1 + k] = P[r1 + k]! + dt * (P[c1 + k]! - P[l1 + k]!) + h2 * y1;
    P[r2 + k] = P[r2 + k]! + dt * (P[c2 + k]! - P[l2 + k]!) + h2 * y2;
    if (k >= 6) {
      P[l0 + k] = P[l0 + k]! - dt * y0;
      P[l1 + k] = P[l1 + k]! - dt * y1;
      P[l2 + k] = P[l2 + k]! - dt * y2;
    }
  }
  if (c.singer) singerRows(P, n, c.alpha, c.beta, c.e);
  // Column pass, F_cvᵀ: with z = R_wb T[i][ba],  P⁺[i][r] = T[i][r] + dt (T[i][vC] - T[i][vL]) + h2 z
  // (rows r only), P⁺[i][vL] = T[i][vL] - dt z (rows r, vC, vL).
  for (let i = 0; i < 9; i++) {
    const row = i * n;
    const t0 = P[row + 9]!, t1 = P[row + 10]!, t2 = P[row + 11]!;
    const z0 = R00 * t0 + R01 * t1 + R02 * t2;
    const z1 = R10 * t0 + R11 * t1 + R12 * t2;
    const z2 = R20 * t0 + R21 * t1 + R22 * t2;
    if (i < 3) {
      P[row] = P[row]! + dt * (P[row + 3]! - P[row + 6]!) + h2 * z0;
      P[row + 1] = P[row + 1]! + dt * (P[row + 4]! - P[row + 7]!) + h2 * z1;
      P[row + 2] = P[row + 2]! + dt * (P[row + 5]! - P[row + 8]!) + h2 * z2;
    }
    P[row + 6] = P[row + 6]! - dt * z0;
    P[row + 7] = P[row + 7]! - dt * z1;
    P[row + 8] = P[row + 8]! - dt * z2;
  }
  if (c.singer) singerColumns(P, n, c.alpha, c.beta, c.e);
  // Q (upper triangle) then mirror.
  // (the carrier blocks of axis z from the vertical noise: the *Z coefficients)
  for (let a = 0; a < 3; a++) {
    const r = a, vc = 3 + a, vl = 6 + a, ba = 9 + a, z = a === 2;
    P[r * n + r] = P[r * n + r]! + (z ? c.QrrZ : c.Qrr);
    P[r * n + vc] = P[r * n + vc]! + (z ? c.QrVcZ : c.QrVc);
    P[r * n + vl] = P[r * n + vl]! + c.QrVl;
    P[vc * n + vc] = P[vc * n + vc]! + (z ? c.QVcVcZ : c.QVcVc);
    P[vl * n + vl] = P[vl * n + vl]! + c.QVlVl;
    P[ba * n + ba] = P[ba * n + ba]! + c.QBaBa;
    if (c.singer) {
      const ac = 12 + a;
      P[r * n + ac] = P[r * n + ac]! + (z ? c.QrAcZ : c.QrAc);
      P[vc * n + ac] = P[vc * n + ac]! + (z ? c.QVcAcZ : c.QVcAc);
      P[ac * n + ac] = P[ac * n + ac]! + (z ? c.QAcAcZ : c.QAcAc);
    }
  }
  let finite = 0;
  for (let i = 0; i < n; i++) finite += x[i]! * 0 + P[i * n + i]! * 0;
  // Mirror two rows at a time: their sources (j, i) and (j, i + 1) sit side by side.
  let i = 1;
  for (; i + 1 < n; i += 2) {
    const row = i * n, next = row + n;
    let a = 0, b = 0;
    for (let j = 0; j < i; j++) {
      const u = P[j * n + i]!, v = P[j * n + i + 1]!;
      P[row + j] = u;
      P[next + j] = v;
      a += u * 0;
      b += v * 0;
    }
    const d = P[row + i + 1]!;
    P[next + i] = d;
    finite += a + b + d * 0;
  }
  for (; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < i; j++) {
      const value = P[j * n + i]!;
      P[row + j] = value;
      finite += value * 0;
    }
  }
  return finite === 0;
}

/**
 * Row pass of the Singer factor, T = F_s (F_cv P), one sweep over the columns: rows r and vC
 * read row aC before it is scaled. Row vC is needed from column vC on and row aC from column
 * aC on (their earlier columns are lower triangle, overwritten by the mirror).
 */
function singerRows(P: Float64Array, n: number, alpha: number, beta: number, e: number): void {
  const r1 = n, r2 = 2 * n, c0 = 3 * n, c1 = 4 * n, c2 = 5 * n, a0 = 12 * n, a1 = 13 * n, a2 = 14 * n;
  for (let k = 0; k < n; k++) {
    const p0 = P[a0 + k]!, p1 = P[a1 + k]!, p2 = P[a2 + k]!;
    P[k] = P[k]! + alpha * p0;
    P[r1 + k] = P[r1 + k]! + alpha * p1;
    P[r2 + k] = P[r2 + k]! + alpha * p2;
    if (k >= 3) {
      P[c0 + k] = P[c0 + k]! + beta * p0;
      P[c1 + k] = P[c1 + k]! + beta * p1;
      P[c2 + k] = P[c2 + k]! + beta * p2;
    }
    if (k >= 12) {
      P[a0 + k] = e * p0;
      P[a1 + k] = e * p1;
      P[a2 + k] = e * p2;
    }
  }
}

/** Column pass of the Singer factor, P⁺ = (T F_cvᵀ) F_sᵀ: columns r (rows r), vC (rows r, vC), aC (all rows). */
function singerColumns(P: Float64Array, n: number, alpha: number, beta: number, e: number): void {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    const t0 = P[row + 12]!, t1 = P[row + 13]!, t2 = P[row + 14]!;
    if (i < 3) {
      P[row] = P[row]! + alpha * t0;
      P[row + 1] = P[row + 1]! + alpha * t1;
      P[row + 2] = P[row + 2]! + alpha * t2;
    }
    if (i < 6) {
      P[row + 3] = P[row + 3]! + beta * t0;
      P[row + 4] = P[row + 4]! + beta * t1;
      P[row + 5] = P[row + 5]! + beta * t2;
    }
    P[row + 12] = e * t0;
    P[row + 13] = e * t1;
    P[row + 14] = e * t2;
  }
}
