import { describe, expect, it } from 'vitest';
import { innovationCovarianceColumnBlock, innovationCovarianceColumnBlockAndColumn, updateJosephColumnBlock } from '../../estimator/filter/columnBlockUpdate.js';
import { readFileSync } from 'node:fs';
import { innovationCovariance3, normalizedInnovationSquared3, updateJoseph3, updateJoseph3Loops } from '../../estimator/filter/blockUpdate3.js';
import { josephUpdateSource } from '../../estimator/codegen/josephUpdateSource.js';
import { innovationCovariance, normalizedInnovationSquared, updateJoseph } from '../../estimator/filter/update.js';
import { UpdateWorkspace } from '../../estimator/filter/UpdateWorkspace.js';
import { RandomStream, streamId } from '../../estimator/random/RandomStream.js';
import { expectAllClose, expectClose } from '../helpers/expectClose.js';

/** A random SPD n x n matrix A Aᵀ + I from a seeded stream. */
function randomCovariance(n: number, stream: RandomStream): Float64Array {
  const A = Array.from({ length: n * n }, () => stream.gaussian());
  const P = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? 1 : 0;
    for (let k = 0; k < n; k++) s += A[i * n + k]! * A[j * n + k]!;
    P[i * n + j] = s / n;
  }
  return P;
}

describe('block-structured updates agree with the dense textbook Joseph update (two implementations of one thing)', () => {
  const n = 12, col = 6;
  const stream = RandomStream.fromKey([12, streamId('column block')]);
  const P0 = randomCovariance(n, stream);
  const x0 = Float64Array.from({ length: n }, () => stream.gaussian());
  const Hb = Float64Array.from({ length: 9 }, () => stream.gaussian());
  const R = new Float64Array([0.5, 0.1, 0, 0.1, 0.4, 0.05, 0, 0.05, 0.3]);
  const y = [0.3, -0.2, 0.1];
  const Hdense = new Float64Array(3 * n);
  for (let a = 0; a < 3; a++) for (let j = 0; j < 3; j++) Hdense[a * n + col + j] = Hb[3 * a + j]!;

  const xd = x0.slice(), Pd = P0.slice(), wsd = new UpdateWorkspace(n, 3);
  innovationCovariance(Pd, Hdense, R, n, 3, wsd);
  wsd.y.set(y);
  const nisDense = normalizedInnovationSquared(wsd, 3);
  updateJoseph(xd, Pd, Hdense, R, n, 3, wsd);

  it('general column block (any m, k)', () => {
    const x = x0.slice(), P = P0.slice(), ws = new UpdateWorkspace(n, 3);
    expect(innovationCovarianceColumnBlock(P, Hb, col, 3, R, n, 3, ws)).toBe(true);
    ws.y.set(y);
    expectClose(normalizedInnovationSquared(ws, 3), nisDense, { rel: 1e-12 }, 'NIS');
    updateJosephColumnBlock(x, P, n, 3, ws);
    // 1e-12: same algebra, different operation order (P entries are O(1)).
    expectAllClose(x, xd, { abs: 1e-12 }, 'x');
    expectAllClose(P, Pd, { abs: 1e-12 }, 'P');
  });

  it('column block plus one column outside it (the deck-scale state), against the dense update', () => {
    // H non-zero in columns 0..5 and 11 (the last state), m = 4
    const m = 4, k = 6, extra = n - 1;
    const s2 = RandomStream.fromKey([14, streamId('column block plus one')]);
    const Hw = Float64Array.from({ length: m * (k + 1) }, () => s2.gaussian());
    const Rm = new Float64Array(m * m);
    for (let a = 0; a < m; a++) Rm[a * m + a] = 0.2 + 0.1 * a;
    const H = new Float64Array(m * n);
    for (let a = 0; a < m; a++) {
      for (let j = 0; j < k; j++) H[a * n + j] = Hw[a * (k + 1) + j]!;
      H[a * n + extra] = Hw[a * (k + 1) + k]!;
    }
    const yy = [0.2, -0.1, 0.3, 0.05];
    const xe = x0.slice(), Pe = P0.slice(), wse = new UpdateWorkspace(n, m);
    innovationCovariance(Pe, H, Rm, n, m, wse);
    wse.y.set(yy);
    const nisExpected = normalizedInnovationSquared(wse, m);
    updateJoseph(xe, Pe, H, Rm, n, m, wse);
    const x = x0.slice(), P = P0.slice(), ws = new UpdateWorkspace(n, m);
    expect(innovationCovarianceColumnBlockAndColumn(P, Hw, 0, k, extra, Rm, n, m, ws)).toBe(true);
    ws.y.set(yy);
    expectClose(normalizedInnovationSquared(ws, m), nisExpected, { rel: 1e-12 }, 'NIS');
    updateJosephColumnBlock(x, P, n, m, ws);
    // 1e-12: same algebra, different operation order (P entries are O(1)).
    expectAllClose(x, xe, { abs: 1e-12 }, 'x');
    expectAllClose(P, Pe, { abs: 1e-12 }, 'P');
  });

  it('column block plus one column, m = 3: the generated Joseph kernel (n = 13) agrees with the loops', () => {
    const n13 = 13, s3 = RandomStream.fromKey([15, streamId('column block plus one')]);
    const P13 = randomCovariance(n13, s3), x13 = Float64Array.from({ length: n13 }, () => s3.gaussian());
    const Hw = Float64Array.from({ length: 3 * 4 }, () => s3.gaussian());
    const ws1 = new UpdateWorkspace(n13, 3), ws2 = new UpdateWorkspace(n13, 3);
    const x1 = x13.slice(), P1 = P13.slice(), x2 = x13.slice(), P2 = P13.slice();
    expect(innovationCovarianceColumnBlockAndColumn(P1, Hw, 0, 3, 12, R, n13, 3, ws1)).toBe(true);
    expect(innovationCovarianceColumnBlockAndColumn(P2, Hw, 0, 3, 12, R, n13, 3, ws2)).toBe(true);
    ws1.y.set(y);
    ws2.y.set(y);
    expect(updateJoseph3(x1, P1, n13, ws1)).toBe(true);
    updateJosephColumnBlock(x2, P2, n13, 3, ws2);
    // 1e-12: same algebra, different operation order (P entries are O(1))
    expectAllClose(x1, x2, { abs: 1e-12 }, 'x');
    expectAllClose(P1, P2, { abs: 1e-12 }, 'P');
  });

  it('unrolled 3 x 3 block, with exact symmetry', () => {
    const x = x0.slice(), P = P0.slice(), ws = new UpdateWorkspace(n, 3);
    expect(innovationCovariance3(P, Hb, col, R, n, ws)).toBe(true);
    ws.y.set(y);
    expectClose(normalizedInnovationSquared3(ws), nisDense, { rel: 1e-12 }, 'NIS');
    expect(updateJoseph3(x, P, n, ws)).toBe(true);
    expectAllClose(x, xd, { abs: 1e-12 }, 'x');
    expectAllClose(P, Pd, { abs: 1e-12 }, 'P');
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(P[i * n + j]).toBe(P[j * n + i]);
  });

  it('innovationCovariance3 refuses an indefinite S (Sylvester criterion)', () => {
    const ws = new UpdateWorkspace(n, 3);
    expect(innovationCovariance3(P0, Hb, col, new Float64Array([-100, 0, 0, 0, 1, 0, 0, 0, 1]), n, ws)).toBe(false);
  });

  it('updateJoseph3 reports a non-finite result', () => {
    const x = x0.slice(), P = P0.slice(), ws = new UpdateWorkspace(n, 3);
    innovationCovariance3(P, Hb, col, R, n, ws);
    ws.y.set([Number.NaN, 0, 0]);
    expect(updateJoseph3(x, P, n, ws)).toBe(false);
  });
});

describe('generated straight-line Joseph updates (josephUpdate.generated.ts)', () => {
  for (const n of [12, 15, 13, 16, 14, 17, 18]) {
    it(`gives the loops x, P, K and K S to the last bit for n = ${n}, for updates on any column block`, () => {
      const stream = RandomStream.fromKey([13, n, streamId('generated joseph')]);
      for (let trial = 0; trial < 200; trial++) {
        const col = [0, 3, 6, 9, n - 3][trial % 5]!;
        const P1 = randomCovariance(n, stream), P2 = P1.slice();
        const x1 = Float64Array.from({ length: n }, () => stream.gaussian()), x2 = x1.slice();
        const Hb = Float64Array.from({ length: 9 }, () => stream.gaussian());
        const R = new Float64Array([0.5, 0.1, 0, 0.1, 0.4, 0.05, 0, 0.05, 0.3]);
        const ws1 = new UpdateWorkspace(n, 3), ws2 = new UpdateWorkspace(n, 3);
        ws1.y.set([stream.gaussian(), stream.gaussian(), stream.gaussian()]);
        ws2.y.set(ws1.y);
        expect(innovationCovariance3(P1, Hb, col, R, n, ws1)).toBe(true);
        expect(innovationCovariance3(P2, Hb, col, R, n, ws2)).toBe(true);
        expect(updateJoseph3(x1, P1, n, ws1)).toBe(true); // dispatches to the generated code
        expect(updateJoseph3Loops(x2, P2, n, ws2)).toBe(true);
        expect(Array.from(P1)).toEqual(Array.from(P2));
        expect(Array.from(x1)).toEqual(Array.from(x2));
        expect(Array.from(ws1.K)).toEqual(Array.from(ws2.K));
        expect(Array.from(ws1.KS)).toEqual(Array.from(ws2.KS));
      }
    });
  }

  it('is what its generator writes (run `npm run codegen` after changing the generator)', () => {
    const committed = readFileSync(new URL('../../estimator/filter/josephUpdate.generated.ts', import.meta.url), 'utf8');
    expect(committed).toBe(josephUpdateSource());
  });
});
