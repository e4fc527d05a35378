import { describe, expect, it } from 'vitest';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import {
  createRandomStream,
  loadStream,
  nextWord,
  openUniform,
  replicateStreams,
  streamGenerator,
} from '@shared/engine/simulation/random-stream';
import { fillStandardNormals } from '@shared/engine/simulation/standard-normals';

// The reference here is the pure-rand library itself (a maintained, independently tested
// generator): the engine's copy of the xoroshiro128+ transition must produce its sequence exactly.
describe('the seeded random stream is pure-rand xoroshiro128plus', () => {
  it('nextWord gives the same 10,000 words as pure-rand next() for three seeds', () => {
    for (const seed of [0, 42, 4_294_967_295]) {
      const library = xoroshiro128plus(seed);
      const stream = createRandomStream();
      loadStream(stream, xoroshiro128plus(seed));
      const ours: number[] = [];
      const theirs: number[] = [];
      for (let i = 0; i < 10_000; i++) {
        ours.push(nextWord(stream));
        theirs.push(library.next());
      }
      expect(ours).toEqual(theirs);
      expect(streamGenerator(stream).getState()).toEqual(library.getState());
    }
  });

  it('the normal sampler, which inlines the transition, leaves the stream at a state pure-rand reaches by next()', () => {
    const stream = createRandomStream();
    loadStream(stream, xoroshiro128plus(2024));
    fillStandardNormals(stream, new Float64Array(1000), 1000);
    const target = Array.from(stream.subarray(0, 4));
    const library = xoroshiro128plus(2024);
    let steps = 0;
    while (steps < 10_000 && JSON.stringify(library.getState()) !== JSON.stringify(target)) {
      library.next();
      steps++;
    }
    // 1000 value words, 250 layer words and a few dozen words of slow-path draws.
    expect(steps).toBeGreaterThanOrEqual(1250);
    expect(steps).toBeLessThan(1500);
  });

  it('replicate r starts at xoroshiro128plus(seed) jumped r + 1 times', () => {
    const next = replicateStreams(7);
    const reference = xoroshiro128plus(7);
    const stream = createRandomStream();
    for (let r = 0; r < 5; r++) {
      next(stream);
      reference.jump();
      expect(streamGenerator(stream).getState()).toEqual(reference.getState());
    }
  });

  it('openUniform stays strictly inside (0, 1) and has mean 1/2 and variance 1/12 within 4 Monte Carlo SEs', () => {
    const stream = createRandomStream();
    replicateStreams(11)(stream);
    const draws = 200_000;
    let sum = 0;
    let sumSquares = 0;
    let min = 1;
    let max = 0;
    for (let i = 0; i < draws; i++) {
      const u = openUniform(stream);
      sum += u;
      sumSquares += u * u;
      min = Math.min(min, u);
      max = Math.max(max, u);
    }
    const mean = sum / draws;
    const variance = sumSquares / draws - mean * mean;
    expect(min).toBeGreaterThan(0);
    expect(max).toBeLessThan(1);
    // SE of the mean of U(0,1) is √(1/12/N); of the variance √(1/180/N) (fourth central moment 1/80).
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / draws));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(4 * Math.sqrt((1 / 80 - 1 / 144) / draws));
  });
});
