// Landing-model predict, in place and allocation-free, exploiting the block structure of F:
//   a_L = R_wb (f - ba) + g
//   r  ← r + dt (vC - vL) - dt²/2 a_L + α aC      vC ← vC + β aC     aC ← e aC
//   vL ← vL + dt a_L                               ba ← ba
// F = ∂x⁺/∂x has blocks I, dt I, -dt I, (dt²/2) R_wb (r by ba), -dt R_wb (vL by ba), α I, β I, e I,
// and is block upper triangular (state order r, vC, vL, ba, aC). Hence P⁺ = F P Fᵀ + Q needs,
// for its upper triangle, only the upper triangle of T = F P: the row pass computes T[i][j≥i],
// the column pass turns it into (T Fᵀ)[i][j≥i] in place (ascending blocks), Q is added and the
// upper triangle is mirrored, so P stays exactly symmetric.
import type { ProcessCoefficients } from './ProcessCoefficients.js';
import { STANDARD_GRAVITY } from './landingState.js';

/** Returns false when x or P became non-finite (NaN or ±Infinity anywhere). */
export function predictLanding(x: Float64Array, P: Float64Array, n: number, f: ArrayLike<number>, Rwb: Float64Array, c: ProcessCoefficients): boolean {
  const dt = c.dt, h2 = 0.5 * dt * dt, singer = c.singer;
  const alpha = c.alpha, beta = c.beta, e = c.e;
  const R00 = Rwb[0]!, R01 = Rwb[1]!, R02 = Rwb[2]!, R10 = Rwb[3]!, R11 = Rwb[4]!, R12 = Rwb[5]!, R20 = Rwb[6]!, R21 = Rwb[7]!, R22 = Rwb[8]!;
  // State.
  const f0 = f[0]! - x[9]!, f1 = f[1]! - x[10]!, f2 = f[2]! - x[11]!;
  const a0 = R00 * f0 + R01 * f1 + R02 * f2;
  const a1 = R10 * f0 + R11 * f1 + R12 * f2;
  const a2 = R20 * f0 + R21 * f1 + R22 * f2 - STANDARD_GRAVITY;
  x[0] = x[0]! + dt * (x[3]! - x[6]!) - h2 * a0;
  x[1] = x[1]! + dt * (x[4]! - x[7]!) - h2 * a1;
  x[2] = x[2]! + dt * (x[5]! - x[8]!) - h2 * a2;
  x[6] = x[6]! + dt * a0;
  x[7] = x[7]! + dt * a1;
  x[8] = x[8]! + dt * a2;
  if (singer) {
    for (let i = 0; i < 3; i++) {
      x[i] = x[i]! + alpha * x[12 + i]!;
      x[3 + i] = x[3 + i]! + beta * x[12 + i]!;
      x[12 + i] = e * x[12 + i]!;
    }
  }
  // Row pass: T = F P on the upper triangle (row i, column j >= i), in place, rows of one
  // column in the order r, vL, vC, aC so every read sees the original P.
  for (let j = 0; j < n; j++) {
    const b0 = P[9 * n + j]!, b1 = P[10 * n + j]!, b2 = P[11 * n + j]!;
    const Rb0 = R00 * b0 + R01 * b1 + R02 * b2;
    const Rb1 = R10 * b0 + R11 * b1 + R12 * b2;
    const Rb2 = R20 * b0 + R21 * b1 + R22 * b2;
    for (let a = 0; a < 3 && a <= j; a++) {
      const Rb = a === 0 ? Rb0 : a === 1 ? Rb1 : Rb2;
      const ir = a * n + j;
      let r = P[ir]! + dt * (P[ir + 3 * n]! - P[ir + 6 * n]!) + h2 * Rb;
      if (singer) r += alpha * P[ir + 12 * n]!;
      P[ir] = r;
    }
    for (let a = 0; a < 3 && 6 + a <= j; a++) {
      const il = (6 + a) * n + j;
      P[il] = P[il]! - dt * (a === 0 ? Rb0 : a === 1 ? Rb1 : Rb2);
    }
    if (singer) {
      for (let a = 0; a < 3; a++) {
        if (3 + a <= j) P[(3 + a) * n + j] = P[(3 + a) * n + j]! + beta * P[(12 + a) * n + j]!;
        if (12 + a <= j) P[(12 + a) * n + j] = e * P[(12 + a) * n + j]!;
      }
    }
  }
  // Column pass: P = T Fᵀ on the upper triangle, blocks ascending (r, vC, vL, aC) so every
  // read sees T. Column block r only exists for rows 0..2, vL for rows 0..8.
  for (let i = 0; i < n; i++) {
    const row = i * n;
    if (i < 9) {
      const b0 = P[row + 9]!, b1 = P[row + 10]!, b2 = P[row + 11]!;
      // (T Fᵀ)[i][col] with F rows: r_a -> h2 R_wb[a] · T[i][ba]; vL_a -> -dt R_wb[a] · T[i][ba]
      const Rb0 = R00 * b0 + R01 * b1 + R02 * b2;
      const Rb1 = R10 * b0 + R11 * b1 + R12 * b2;
      const Rb2 = R20 * b0 + R21 * b1 + R22 * b2;
      for (let a = i < 3 ? i : 3; a < 3; a++) {
        let r = P[row + a]! + dt * (P[row + 3 + a]! - P[row + 6 + a]!) + h2 * (a === 0 ? Rb0 : a === 1 ? Rb1 : Rb2);
        if (singer) r += alpha * P[row + 12 + a]!;
        P[row + a] = r;
      }
      if (singer) {
        for (let a = i < 6 ? Math.max(i - 3, 0) : 3; a < 3; a++) P[row + 3 + a] = P[row + 3 + a]! + beta * P[row + 12 + a]!;
      }
      for (let a = i > 6 ? i - 6 : 0; a < 3; a++) P[row + 6 + a] = P[row + 6 + a]! - dt * (a === 0 ? Rb0 : a === 1 ? Rb1 : Rb2);
    }
    if (singer) {
      for (let a = i > 12 ? i - 12 : 0; a < 3; a++) P[row + 12 + a] = e * P[row + 12 + a]!;
    }
  }
  // Q (upper triangle) then mirror.
  for (let a = 0; a < 3; a++) {
    const r = a, vc = 3 + a, vl = 6 + a, ba = 9 + a;
    P[r * n + r] = P[r * n + r]! + c.Qrr;
    P[r * n + vc] = P[r * n + vc]! + c.QrVc;
    P[r * n + vl] = P[r * n + vl]! + c.QrVl;
    P[vc * n + vc] = P[vc * n + vc]! + c.QVcVc;
    P[vl * n + vl] = P[vl * n + vl]! + c.QVlVl;
    P[ba * n + ba] = P[ba * n + ba]! + c.QBaBa;
    if (singer) {
      const ac = 12 + a;
      P[r * n + ac] = P[r * n + ac]! + c.QrAc;
      P[vc * n + ac] = P[vc * n + ac]! + c.QVcAc;
      P[ac * n + ac] = P[ac * n + ac]! + c.QAcAc;
    }
  }
  let finite = 0;
  for (let i = 0; i < n; i++) {
    finite += x[i]! * 0 + P[i * n + i]! * 0;
    for (let j = 0; j < i; j++) {
      const value = P[j * n + i]!;
      P[i * n + j] = value;
      finite += value * 0;
    }
  }
  return finite === 0;
}
