// The seeded source of randomness for every simulation. The generator is pure-rand's
// xoroshiro128plus (a maintained library); the engine only copies its state into a typed array so
// the hot loops can run the same transition on local variables.
import { xoroshiro128plus, xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus';
import type { JumpableRandomGenerator } from 'pure-rand/types/JumpableRandomGenerator';

/**
 * Mutable generator state shared by the samplers: slots 0–3 hold pure-rand's xoroshiro128plus
 * state words in the order of its getState() (s0 high, s0 low, s1 high, s1 low); slots 4 and 5
 * hold the ziggurat's unused layer bits and how many 7-bit layer indices remain in them.
 */
export type RandomStream = Int32Array;

const STATE_WORDS = 4;
const LAYER_WORD = 4;
const LAYERS_LEFT = 5;

/**
 * An empty stream; load a state into it with `loadStream` before drawing from it.
 * @example const stream = createRandomStream(); loadStream(stream, xoroshiro128plus(42));
 */
export function createRandomStream(): RandomStream {
  return new Int32Array(STATE_WORDS + 2);
}

/** Copies a pure-rand xoroshiro128plus state into `stream` and clears the ziggurat's layer bits. */
export function loadStream(stream: RandomStream, generator: JumpableRandomGenerator): void {
  const state = generator.getState();
  for (let i = 0; i < STATE_WORDS; i++) stream[i] = state[i] ?? 0;
  stream[LAYER_WORD] = 0;
  stream[LAYERS_LEFT] = 0;
}

/** The stream's position as a pure-rand generator (for tests and for handing the stream back). */
export function streamGenerator(stream: RandomStream): JumpableRandomGenerator {
  return xoroshiro128plusFromState(Array.from(stream.subarray(0, STATE_WORDS)));
}

/**
 * Next 32-bit word of the stream, identical to pure-rand's xoroshiro128plus `next()` (the low 32
 * bits of s0 + s1, then the xoroshiro128+ state update with rotations 24, 16 and 37).
 * Source: Blackman D, Vigna S. Scrambled linear pseudorandom number generators. ACM Trans Math
 * Softw 2021;47(4):36. doi:10.1145/3460772. The unit tests check it word for word against pure-rand.
 * @example nextWord(stream) // a signed 32-bit integer
 */
export function nextWord(stream: RandomStream): number {
  const s01 = stream[0] ?? 0;
  const s00 = stream[1] ?? 0;
  const s11 = stream[2] ?? 0;
  const s10 = stream[3] ?? 0;
  const out = (s00 + s10) | 0;
  const a0 = s10 ^ s00;
  const a1 = s11 ^ s01;
  stream[1] = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
  stream[0] = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
  stream[3] = (a1 << 5) ^ (a0 >>> 27);
  stream[2] = (a0 << 5) ^ (a1 >>> 27);
  return out;
}

const TWO_POW_26 = 67108864;
const TWO_POW_MINUS_53 = 1 / 9007199254740992;

/**
 * Uniform draw on the open interval (0, 1) with 53 random bits: the top 27 bits of one word and
 * the top 26 of the next, plus one half-step so 0 and 1 never occur (safe under log). The top bits
 * are used because the lowest bits of xoroshiro128+ have low linear complexity (Blackman & Vigna 2021).
 * @example openUniform(stream) // e.g. 0.7231…, never 0 or 1
 */
export function openUniform(stream: RandomStream): number {
  const high = nextWord(stream) >>> 5;
  const low = nextWord(stream) >>> 6;
  return (high * TWO_POW_26 + low + 0.5) * TWO_POW_MINUS_53;
}

/** Handles to the ziggurat's layer-bit slots, for the normal sampler only. */
export const STREAM_LAYER_WORD = LAYER_WORD;
export const STREAM_LAYERS_LEFT = LAYERS_LEFT;

/**
 * Independent streams for the replicates of one simulation: replicate r (counting from 0) draws
 * from xoroshiro128plus(seed) jumped r + 1 times, 2⁶⁴ steps apart (pure-rand's `jump`, the
 * library's recommended way to get unrelated sequences). A replicate's data therefore depend only
 * on the seed and its index, never on how the run was split into chunks.
 * The seed is taken as a 32-bit pattern (seed | 0), as pure-rand does.
 * @example const next = replicateStreams(42); next(stream); // stream now holds replicate 0
 */
export function replicateStreams(seed: number): (stream: RandomStream) => void {
  const generator = xoroshiro128plus(seed);
  return (stream) => {
    generator.jump();
    loadStream(stream, generator);
  };
}
