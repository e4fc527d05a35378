// fast-check arbitraries for plan documents that satisfy projectSchema, built field by field from
// the rules in shared/model/project.ts (open unit interval, positive, whole numbers, ranges with
// low ≤ high, dates as YYYY-MM-DD). Optional fields are sometimes left out, so defaults are
// exercised too. The arbitraries produce the *input* form; compare against projectSchema.parse(x).
import fc from 'fast-check';
import { FORMAT_TAG, SCHEMA_VERSION } from '@shared/model/project';
import type { ProjectInput } from '@shared/model/project';

// JSON has no negative zero: -0 is written as 0, so generated numbers use +0 only.
const noNegativeZero = (v: number): number => (Object.is(v, -0) ? 0 : v);

const openUnit = fc.double({ min: 0, max: 1, minExcluded: true, maxExcluded: true, noNaN: true }).map(noNegativeZero);
const positive = fc.double({ min: Number.MIN_VALUE, max: 1e12, noNaN: true });
const finite = fc.double({ min: -1e12, max: 1e12, noNaN: true }).map(noNegativeZero);
const wholeCount = fc.integer({ min: 1, max: 100_000_000 });

/** Text in every script, emoji included; JSON-significant characters come up often enough. */
const text = (maxLength: number) =>
  fc.oneof(fc.string({ maxLength }), fc.string({ unit: 'grapheme', maxLength }), fc.string({ unit: 'binary', maxLength }));
const nonBlank = (maxLength: number) => text(maxLength).filter((s) => s.trim().length > 0);

const slope = fc.double({ min: -100, max: 100, noNaN: true }).filter((v) => v !== 0);

/** Each anticipated value's own domain; a range's ends must lie in it too. */
const anticipatedValue = {
  rSquared: openUnit,
  outcomeVariance: positive,
  rSquaredCitl: openUnit,
  rSquaredSlope: openUnit,
  slope,
  outcomeMean: finite,
  outcomeSd: positive,
};

const anticipated = fc.record(anticipatedValue, { requiredKeys: ['rSquared', 'outcomeVariance'] });

const rangeOf = (value: fc.Arbitrary<number>) =>
  fc.tuple(value, value).map(([a, b]) => ({ low: Math.min(a, b), high: Math.max(a, b) }));
const ranges = fc.record(
  {
    rSquared: rangeOf(openUnit),
    outcomeVariance: rangeOf(positive),
    rSquaredCitl: rangeOf(openUnit),
    rSquaredSlope: rangeOf(openUnit),
    // both ends on one side of 0: every slope between them must be admissible
    slope: fc
      .tuple(fc.boolean(), rangeOf(fc.double({ min: Number.MIN_VALUE, max: 100, noNaN: true })))
      .map(([negative, r]) => (negative ? { low: -r.high, high: -r.low } : r)),
    outcomeMean: rangeOf(finite),
    outcomeSd: rangeOf(positive),
  },
  { requiredKeys: [] },
);

const precision = fc.record(
  {
    confidence: openUnit,
    rSquared: fc.record({ width: positive }, { requiredKeys: [] }),
    citl: fc.record({ width: positive }),
    slope: fc.record({ width: positive }, { requiredKeys: [] }),
    residualSd: fc.record({ marginFactor: fc.double({ min: 1, max: 10, minExcluded: true, noNaN: true }) }, { requiredKeys: [] }),
  },
  { requiredKeys: ['citl'] },
);

const fractionUpToOne = fc.double({ min: 0, max: 1, minExcluded: true, noNaN: true });
const recruitment = fc.record(
  {
    accrualPerMonth: positive,
    eligibleFraction: fractionUpToOne,
    consentFraction: fractionUpToOne,
    missingOutcomeFraction: fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true }).map(noNegativeZero),
    availableN: wholeCount,
  },
  { requiredKeys: [] },
);

// "__proto__" is left out of record keys: zod drops it on purpose (prototype pollution guard).
const recordKey = text(30).filter((k) => k !== '__proto__');

const population = (id: string) =>
  fc.record(
    {
      id: fc.constant(id),
      name: nonBlank(60),
      notes: text(200),
      outcome: fc.constant('continuous' as const),
      anticipated,
      ranges,
      sources: fc.dictionary(recordKey, text(80), { maxKeys: 3 }),
      precision,
      recruitment,
    },
    { requiredKeys: ['id', 'name', 'outcome', 'anticipated', 'precision'] },
  );

const isoDate = fc
  .date({ min: new Date('1900-01-01T00:00:00Z'), max: new Date('2999-12-31T00:00:00Z'), noInvalidDate: true })
  .map((d) => d.toISOString().slice(0, 10));

/** A valid plan in input form, with up to `maxPopulations` populations (unique ids). */
export function projectInputArbitrary(maxPopulations = 5): fc.Arbitrary<ProjectInput> {
  const ids = fc.uniqueArray(
    text(40).filter((s) => s.length > 0),
    { maxLength: maxPopulations },
  );
  return fc.record(
    {
      format: fc.constant(FORMAT_TAG),
      schemaVersion: fc.constant(SCHEMA_VERSION),
      name: nonBlank(80),
      description: text(300),
      outcome: fc.constant('continuous' as const),
      model: fc.record(
        { name: text(60), description: text(200), reportedPerformance: text(100), reportedRSquared: openUnit },
        { requiredKeys: [] },
      ),
      updating: fc.record(
        {
          enabled: fc.boolean(),
          predictorParameters: wholeCount,
          anticipatedAdjustedRSquared: openUnit,
          targetShrinkage: openUnit,
          optimismMargin: openUnit,
          shrinkageForm: fc.constantFrom('adjusted-r2-link' as const, 'closed-form' as const),
        },
        { requiredKeys: [] },
      ),
      study: fc.record(
        { startDate: isoDate, windowMonths: fc.double({ min: Number.MIN_VALUE, max: 600, noNaN: true }) },
        { requiredKeys: [] },
      ),
      populations: ids.chain((list) => fc.tuple(...list.map((id) => population(id)))),
    },
    { requiredKeys: ['format', 'schemaVersion', 'name', 'outcome', 'populations'] },
  );
}
