import { describe, expect, it } from 'vitest';
import { normalCdf } from '@shared/engine/numerics/distributions';
import { SIMULATION_ENGINE_VERSION } from '@shared/engine/simulation/engine-version';
import { createRandomStream, replicateStreams } from '@shared/engine/simulation/random-stream';
import type { RandomStream } from '@shared/engine/simulation/random-stream';
import { fillStandardNormals } from '@shared/engine/simulation/standard-normals';
import { ZIGGURAT_TAIL_START } from '@shared/engine/simulation/ziggurat-tables';
import { expectClose } from '../../helpers/expect-close';

function streamFor(seed: number): RandomStream {
  const stream = createRandomStream();
  replicateStreams(seed)(stream);
  return stream;
}

function draw(seed: number, count: number): Float64Array {
  const out = new Float64Array(count);
  fillStandardNormals(streamFor(seed), out, count);
  return out;
}

// The reference distribution is the standard normal cdf of @stdlib (an independent, maintained
// implementation). The seeds are fixed, so each check is deterministic; every bound is 4 Monte Carlo
// SEs (or the 0.1% critical value), which a correct sampler passes for all but about 1 seed in
// 10,000 and which a sampler off by a few per cent in any of these features fails.
describe('the ziggurat sampler draws standard normals', () => {
  it('matches the normal cdf: Kolmogorov–Smirnov distance below the 0.1% critical value 1.949/√N (N = 100,000)', () => {
    const n = 100_000;
    const x = Array.from(draw(1, n)).sort((a, b) => a - b);
    let distance = 0;
    x.forEach((value, i) => {
      const f = normalCdf(value);
      distance = Math.max(distance, Math.abs(f - i / n), Math.abs(f - (i + 1) / n));
    });
    expect(distance).toBeLessThan(1.949 / Math.sqrt(n));
  });

  it('has mean 0, variance 1, skewness 0 and kurtosis 3 within 4 Monte Carlo SEs (N = 1,000,000)', () => {
    const n = 1_000_000;
    const x = draw(2, n);
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    let s4 = 0;
    for (const v of x) {
      s1 += v;
      s2 += v * v;
      s3 += v * v * v;
      s4 += v * v * v * v;
    }
    // Sampling SDs of the raw moments of N(0,1): √(1/N), √(2/N), √(15/N), √(96/N).
    expectClose(s1 / n, 0, 4 * Math.sqrt(1 / n), 'mean');
    expectClose(s2 / n, 1, 4 * Math.sqrt(2 / n), 'second moment');
    expectClose(s3 / n, 0, 4 * Math.sqrt(15 / n), 'third moment');
    expectClose(s4 / n, 3, 4 * Math.sqrt(96 / n), 'fourth moment');
  });

  it('puts the normal share of draws in the tail beyond r = 3.4426 (the slow path) and beyond 4', () => {
    const n = 2_000_000;
    const x = draw(3, n);
    for (const cut of [ZIGGURAT_TAIL_START, 4]) {
      const p = 2 * (1 - normalCdf(cut));
      const share = x.filter((v) => Math.abs(v) > cut).length / n;
      expectClose(share, p, 4 * Math.sqrt((p * (1 - p)) / n), `P(|Z| > ${cut})`);
    }
  });

  it('puts the normal share of draws in each of 40 equal-probability bins (chi-square below its 0.1% point 72.05, df 39)', () => {
    const n = 400_000;
    const bins = 40;
    const counts = new Array<number>(bins).fill(0);
    for (const v of draw(4, n)) {
      const bin = Math.min(bins - 1, Math.floor(normalCdf(v) * bins));
      counts[bin] = (counts[bin] ?? 0) + 1;
    }
    const expected = n / bins;
    const chiSquare = counts.reduce((s, c) => s + ((c - expected) * (c - expected)) / expected, 0);
    expect(chiSquare).toBeLessThan(72.05);
  });

  it('gives the same sequence however the draws are split between calls (unused layer bits are kept)', () => {
    const whole = draw(5, 5000);
    const stream = streamFor(5);
    const pieces = new Float64Array(5000);
    let at = 0;
    for (let size = 1; at < 5000; size = (size % 13) + 1) {
      const count = Math.min(size, 5000 - at);
      fillStandardNormals(stream, pieces.subarray(at), count);
      at += count;
    }
    expect(pieces).toEqual(whole);
  });

  it(`pins the first draws for seed 42 (regression values of ${SIMULATION_ENGINE_VERSION}; a change must bump the version)`, () => {
    const pinned = [
      -1.2966352668105463, -0.10930071794352723, -1.9299172681801455, -0.59767591676306853, 1.1544996447395772,
      -0.5267114367329655,
    ];
    const x = draw(42, pinned.length);
    pinned.forEach((value, i) => expectClose(x[i] ?? Number.NaN, value, 1e-14, `draw ${i}`));
  });
});
