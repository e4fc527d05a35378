// Properties of the across-sites summary over random invented plans: whatever the sites, τ and
// targets, it never throws, never proposes more than a site can recruit, meets the targets when it
// says it does, and writes no NaN or Infinity.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { baseCase, pooledParagraph, pooledSummary } from '@shared/summary/pooled-summary';
import { plan, type ClinicInput } from './pooled-test-plans';

const clinicArbitrary = (id: string): fc.Arbitrary<ClinicInput> =>
  fc.oneof(
    fc.record({
      id: fc.constant(id),
      rSquared: fc.double({ min: 0.15, max: 0.8, noNaN: true }),
      availableN: fc.integer({ min: 5, max: 3000 }),
      accrualPerMonth: fc.double({ min: 5, max: 300, noNaN: true }),
    }),
    fc.record({
      id: fc.constant(id),
      rSquared: fc.double({ min: 0.15, max: 0.8, noNaN: true }),
      accrualPerMonth: fc.double({ min: 0.5, max: 300, noNaN: true }),
      consentFraction: fc.double({ min: 0.3, max: 1, noNaN: true }),
      missingOutcomeFraction: fc.double({ min: 0, max: 0.3, noNaN: true }),
    }),
  );

const plansArbitrary = fc.record({
  clinics: fc
    .integer({ min: 2, max: 6 })
    .chain((k) => fc.tuple(...Array.from({ length: k }, (_, i) => clinicArbitrary(`s${i}`)))),
  aim: fc.constantFrom('pooled', 'pooled', 'pooled', 'both'),
  objective: fc.constantFrom('fewest-participants', 'shortest-recruitment'),
  window: fc.integer({ min: 6, max: 48 }),
  slopeTau: fc.double({ min: 0, max: 0.2, noNaN: true }),
  slopeWidth: fc.double({ min: 0.1, max: 0.8, noNaN: true }),
  slopePi: fc.option(fc.double({ min: 0.3, max: 3, noNaN: true }), { nil: undefined }),
  r2: fc.option(
    fc.record({
      tau: fc.double({ min: 0, max: 0.1, noNaN: true }),
      summaryCiWidth: fc.double({ min: 0.03, max: 0.5, noNaN: true }),
    }),
    {
      nil: undefined,
    },
  ),
});

describe('the pooled proposal over random plans', () => {
  it('never exceeds a site’s capacity, meets every target when feasible, and explains itself otherwise', () => {
    const statuses: string[] = [];
    fc.assert(
      fc.property(plansArbitrary, (p) => {
        const project = plan(
          p.clinics,
          {
            aim: p.aim,
            objective: p.objective,
            measures: {
              slope: {
                tau: p.slopeTau,
                summaryCiWidth: p.slopeWidth,
                ...(p.slopePi === undefined ? {} : { predictionIntervalWidth: p.slopePi }),
              },
              ...(p.r2 === undefined ? {} : { rSquared: p.r2 }),
            },
          },
          p.window,
        );
        const summary = pooledSummary(project);
        const proposal = summary.proposal;
        expect(proposal).not.toBeNull();
        statuses.push(proposal?.status ?? 'none');
        summary.sites.forEach((site, i) => {
          const n = proposal?.sites[i]?.n ?? null;
          if (n !== null) expect(n).toBeLessThanOrEqual(site.capacity ?? -1);
        });
        if (proposal?.status === 'feasible') {
          expect(proposal.sites.every((s) => s.n !== null)).toBe(true);
          for (const m of summary.measures) expect(baseCase(m.atProposal)?.precision.meets).toBe(true);
        } else {
          expect(proposal?.sites.every((s) => s.n === null)).toBe(true);
          expect(proposal?.messages.length).toBeGreaterThan(0);
        }
        expect(pooledParagraph(summary)).not.toMatch(/NaN|Infinity|undefined/);
      }),
      { numRuns: 120, seed: 20260302 },
    );
    // The random plans reach both branches often enough for the property to bite.
    expect(statuses.filter((s) => s === 'feasible').length).toBeGreaterThanOrEqual(20);
    expect(statuses.filter((s) => s !== 'feasible').length).toBeGreaterThanOrEqual(10);
  });
});
