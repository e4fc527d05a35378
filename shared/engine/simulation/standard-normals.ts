import { nextWord, openUniform, STREAM_LAYER_WORD, STREAM_LAYERS_LEFT } from './random-stream';
import type { RandomStream } from './random-stream';
import { buildZigguratTables, ZIGGURAT_TAIL_START } from './ziggurat-tables';

const { k: K, w: W, f: F } = buildZigguratTables();
const INVERSE_TAIL_START = 1 / ZIGGURAT_TAIL_START;

/**
 * Exact slow path of the ziggurat for a word `word` that fell outside layer `layer`'s rectangle:
 * the tail beyond r by Marsaglia's exponential method, the wedges by comparing a uniform height
 * with the density, and otherwise a fresh word and a fresh layer.
 * Source: Marsaglia & Tsang, J Stat Softw 2000;5(8), doi:10.18637/jss.v005.i08 (their nfix), with
 * the layer drawn from separate bits, as recommended by Doornik JA, An improved ziggurat method to
 * generate normal random samples (University of Oxford, 2005).
 */
function slowNormal(stream: RandomStream, word: number, layer: number): number {
  let hz = word;
  let iz = layer;
  for (;;) {
    const x = hz * W[iz]!;
    if (iz === 0) {
      let tail: number;
      let y: number;
      do {
        tail = -Math.log(openUniform(stream)) * INVERSE_TAIL_START;
        y = -Math.log(openUniform(stream));
      } while (y + y < tail * tail);
      return hz > 0 ? ZIGGURAT_TAIL_START + tail : -ZIGGURAT_TAIL_START - tail;
    }
    if (F[iz]! + openUniform(stream) * (F[iz - 1]! - F[iz]!) < Math.exp(-0.5 * x * x)) return x;
    hz = nextWord(stream);
    iz = nextWord(stream) >>> 25;
    if (Math.abs(hz) < K[iz]!) return hz * W[iz]!;
  }
}

/**
 * Writes `count` independent standard normal draws into out[0 … count − 1], advancing `stream`.
 * Method: the 128-layer ziggurat (Marsaglia & Tsang, J Stat Softw 2000;5(8),
 * doi:10.18637/jss.v005.i08). Each draw takes one 32-bit word for its value; the layer index comes
 * from the top 28 bits of a separate word shared by four draws (7 bits each), so the value's bits
 * and the layer are independent (Doornik 2005) and the weak low bits of xoroshiro128+ never pick a
 * layer. About 1.2% of draws take the exact slow path; the result is exactly normal up to the
 * 32-bit resolution of the value within a layer (steps of about 2⁻³¹ · 3.4).
 * The xoroshiro128+ transition is written out here on local variables for speed; it is the same
 * as `nextWord` (and pure-rand's next()), which the unit tests check.
 * Domain: count ≤ out.length, a non-negative integer. The sequence does not depend on how draws
 * are split between calls: unused layer bits are kept in the stream.
 * Reproducible on every machine: integer arithmetic for the stream, and only Math.log/Math.exp
 * on the rare slow path (identical across V8 builds to the printed precision).
 * @example fillStandardNormals(stream, buffer, 1000) // buffer[0…999] ~ N(0, 1)
 */
export function fillStandardNormals(stream: RandomStream, out: Float64Array, count: number): void {
  let s01 = stream[0]!;
  let s00 = stream[1]!;
  let s11 = stream[2]!;
  let s10 = stream[3]!;
  let layers = stream[STREAM_LAYER_WORD]!;
  let layersLeft = stream[STREAM_LAYERS_LEFT]!;
  let i = 0;
  while (i < count) {
    const word = (s00 + s10) | 0;
    const a0 = s10 ^ s00;
    const a1 = s11 ^ s01;
    const t00 = s00;
    const t01 = s01;
    s00 = (t00 << 24) ^ (t01 >>> 8) ^ a0 ^ (a0 << 16);
    s01 = (t01 << 24) ^ (t00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
    s10 = (a1 << 5) ^ (a0 >>> 27);
    s11 = (a0 << 5) ^ (a1 >>> 27);
    if (layersLeft === 0) {
      layers = word;
      layersLeft = 4;
      continue;
    }
    const layer = layers >>> 25;
    layers <<= 7;
    layersLeft--;
    if (Math.abs(word) < K[layer]!) {
      out[i++] = word * W[layer]!;
      continue;
    }
    stream[0] = s01;
    stream[1] = s00;
    stream[2] = s11;
    stream[3] = s10;
    out[i++] = slowNormal(stream, word, layer);
    s01 = stream[0]!;
    s00 = stream[1]!;
    s11 = stream[2]!;
    s10 = stream[3]!;
  }
  stream[0] = s01;
  stream[1] = s00;
  stream[2] = s11;
  stream[3] = s10;
  stream[STREAM_LAYER_WORD] = layers;
  stream[STREAM_LAYERS_LEFT] = layersLeft;
}
