// fast-check arbitraries for binary-outcome populations that satisfy binaryPopulationSchema, in
// input form (optional fields sometimes left out so that defaults are exercised). The values stay
// inside the domains planning can take on quickly: outcome proportions from 0.02 to 0.5, C from
// 0.55 to 0.9, a linear predictor given or fitted, risk thresholds from a fixed list.
import fc from 'fast-check';

const between = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

/** A risk threshold with, sometimes, both sensitivity and specificity. */
const threshold = (t: number) =>
  fc.oneof(
    fc.constant({ threshold: t }),
    fc.record({ threshold: fc.constant(t), sensitivity: between(0.3, 0.95), specificity: between(0.3, 0.95) }),
  );

interface ThresholdInput {
  readonly threshold: number;
  readonly sensitivity?: number;
  readonly specificity?: number;
}

const thresholds: fc.Arbitrary<ThresholdInput[]> = fc
  .subarray([0.05, 0.1, 0.2, 0.3], { maxLength: 2 })
  .chain((list) => (list.length === 0 ? fc.constant([]) : fc.tuple(...list.map(threshold)).map((t) => [...t])));

/** Anticipated values: a C-statistic (the LP fitted to it), or a given LP, with optional miscalibration. */
export const binaryAnticipatedArbitrary = fc
  .record({
    outcomeProportion: between(0.02, 0.5),
    lp: fc.oneof(
      fc.record({ cStatistic: between(0.55, 0.9) }),
      fc.record({ lpMean: between(-4, 1), lpSd: between(0.4, 2) }, { requiredKeys: ['lpMean', 'lpSd'] }),
    ),
    calibrationIntercept: fc.option(between(-0.5, 0.5), { nil: undefined }),
    calibrationSlope: fc.option(between(0.7, 1.3), { nil: undefined }),
    thresholds,
  })
  .map(({ lp, calibrationIntercept, calibrationSlope, ...rest }) => ({
    ...rest,
    ...lp,
    ...(calibrationIntercept === undefined ? {} : { calibrationIntercept }),
    ...(calibrationSlope === undefined ? {} : { calibrationSlope }),
  }));

/** Precision targets: the schema's defaults, or other widths in either O/E convention. */
export const binaryPrecisionArbitrary = fc.oneof(
  fc.constant({}),
  fc.record({
    confidence: fc.constantFrom(0.9, 0.95, 0.99),
    oe: fc.oneof(fc.record({ width: between(0.1, 0.6) }), fc.record({ lower: between(0.7, 0.95), upper: between(1.05, 1.4) })),
    slope: fc.record({ width: between(0.15, 0.6) }),
    cStatistic: fc.record({ width: between(0.05, 0.2) }),
    netBenefit: fc.record({ width: between(0.1, 0.5), standardised: fc.boolean() }),
  }),
);

/** A binary population in input form with the given id. */
export function binaryPopulationArbitrary(id: string) {
  return fc.record({
    id: fc.constant(id),
    name: fc.constant(`Site ${id}`),
    outcome: fc.constant('binary' as const),
    anticipated: binaryAnticipatedArbitrary,
    precision: binaryPrecisionArbitrary,
  });
}
