/** The three 128-entry tables of the ziggurat sampler for the standard normal. */
export interface ZigguratTables {
  /** Acceptance bound of layer i on the |32-bit word| scale (the rectangle's inner share × 2³¹). */
  readonly k: Float64Array;
  /** Word-to-x scale of layer i (the layer's right edge x_i ÷ 2³¹; layer 0 uses v / f(r)). */
  readonly w: Float64Array;
  /** Density f(x_i) = exp(−x_i²/2) at each layer's right edge (unnormalised). */
  readonly f: Float64Array;
}

/** Right edge of the base layer: the normal tail starts at r (128 layers). */
export const ZIGGURAT_TAIL_START = 3.442619855899;
/** Area of each layer, v, for 128 layers with the unnormalised density exp(−x²/2). */
const LAYER_AREA = 9.91256303526217e-3;
const TWO_POW_31 = 2147483648;

/**
 * Builds the tables of the 128-layer ziggurat: x_127 = r, then x_i = sqrt(−2 ln(v / x_{i+1} +
 * f(x_{i+1}))) going up, so every layer (the base with its tail included) has area v.
 * Source: Marsaglia G, Tsang WW. The ziggurat method for generating random variables. J Stat Softw
 * 2000;5(8). doi:10.18637/jss.v005.i08 (their zigset, in double precision).
 * Accuracy: the constants r and v are the paper's; the tables only decide which draws take the
 * exact slow path, so rounding in them cannot bias the distribution beyond double precision.
 * Reproducibility: Math.exp, Math.log and Math.sqrt are IEEE-correct enough that the tables are
 * the same on every machine; results are reproducible across V8 builds to the printed precision.
 * @example buildZigguratTables().w[127] * 2 ** 31 // 3.442619855899 (= r)
 */
export function buildZigguratTables(): ZigguratTables {
  const k = new Float64Array(128);
  const w = new Float64Array(128);
  const f = new Float64Array(128);
  let x = ZIGGURAT_TAIL_START;
  let previous = x;
  const q = LAYER_AREA / Math.exp(-0.5 * x * x);
  k[0] = Math.floor((x / q) * TWO_POW_31);
  k[1] = 0;
  w[0] = q / TWO_POW_31;
  w[127] = x / TWO_POW_31;
  f[0] = 1;
  f[127] = Math.exp(-0.5 * x * x);
  for (let i = 126; i >= 1; i--) {
    x = Math.sqrt(-2 * Math.log(LAYER_AREA / x + Math.exp(-0.5 * x * x)));
    k[i + 1] = Math.floor((x / previous) * TWO_POW_31);
    previous = x;
    f[i] = Math.exp(-0.5 * x * x);
    w[i] = x / TWO_POW_31;
  }
  return { k, w, f };
}
