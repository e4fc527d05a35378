import { describe, expect, it } from 'vitest';
import { planForAim, type AimSite } from '@shared/engine/pooled/planning-aim';
import type { PooledMeasure } from '@shared/engine/pooled/types';

const seA = (a: number) => (n: number) => Math.sqrt(a / n);
const measure: PooledMeasure = { id: 'slope', label: 'Calibration slope', tau: 0.03, target: { maxSummaryCiWidth: 0.1 } };
const site = (id: string, siteSpecificN: number | null, capacity: number | 'unlimited' = 5000): AimSite => ({
  id,
  capacity,
  minimumN: 20,
  siteSpecificN,
  seAtN: { slope: seA(1) },
});

describe('planForAim', () => {
  it('site-specific: each site gets its own n; the pooled precision at those n is shown for information', () => {
    const plan = planForAim({
      aim: 'site-specific',
      sites: [site('A', 400), site('B', 250), site('C', 900)],
      measures: [measure],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('feasible');
    expect(plan.sites.map((s) => [s.n, s.setBy])).toEqual([
      [400, 'own-targets'],
      [250, 'own-targets'],
      [900, 'own-targets'],
    ]);
    expect(plan.totalN).toBe(1550);
    expect(plan.pooled?.[0]?.meets).toBe(false); // Σ n/(1 + τ²n) ≈ 995 < (2z/0.1)² = 1,537 [DERIVED]
    expect(plan.messages.join(' ')).toContain('not met for: Calibration slope (for information; the aim is site-specific)');
  });

  it('site-specific: a site whose own n exceeds its capacity makes the plan infeasible and is named', () => {
    const plan = planForAim({
      aim: 'site-specific',
      sites: [site('A', 400), site('B', 800, 500)],
      measures: [],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.sites[1]?.withinCapacity).toBe(false);
    expect(plan.messages).toContain('Site B needs 800 for its own targets but can recruit 500.');
    expect(plan.pooled).toBeNull();
  });

  it('both: every site keeps at least its own n, and the pooled target raises some sites above it', () => {
    const plan = planForAim({
      aim: 'both',
      sites: [site('A', 400), site('B', 250), site('C', 900)],
      measures: [measure],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('feasible');
    const n = plan.sites.map((s) => s.n ?? 0);
    expect(n[0]).toBeGreaterThanOrEqual(400);
    expect(n[1]).toBeGreaterThanOrEqual(250);
    expect(n[2]).toBeGreaterThanOrEqual(900);
    expect(plan.pooled?.[0]?.meets).toBe(true);
    expect(plan.sites.some((s) => s.setBy === 'pooled-targets')).toBe(true);
    // the smallest site gains most from extra participants (concave weights), so it is raised first
    expect(plan.sites[1]?.setBy).toBe('pooled-targets');
    expect(plan.totalN).toBeGreaterThan(1550);
  });

  it('pooled: own requirements are ignored; sites start from their minimum n and need fewer in total than both', () => {
    const sites = [site('A', 400), site('B', 250), site('C', 900)];
    const pooled = planForAim({ aim: 'pooled', sites, measures: [measure], objective: 'fewest-participants' });
    const both = planForAim({ aim: 'both', sites, measures: [measure], objective: 'fewest-participants' });
    expect(pooled.status).toBe('feasible');
    expect(pooled.totalN ?? Number.POSITIVE_INFINITY).toBeLessThanOrEqual(both.totalN ?? 0);
    const ns = pooled.sites.map((s) => s.n ?? 0);
    expect(Math.max(...ns) - Math.min(...ns)).toBeLessThanOrEqual(1); // identical sites share evenly
  });

  it('both: a site whose own requirement is unknown makes the plan not assessable (never skipped silently)', () => {
    const plan = planForAim({
      aim: 'both',
      sites: [site('A', 400), site('B', null)],
      measures: [measure],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('not-assessable');
    expect(plan.messages[0]).toContain('B');
    expect(plan.totalN).toBeNull();
  });

  it('both: a site whose own n exceeds its capacity is named and the plan is infeasible', () => {
    const plan = planForAim({
      aim: 'both',
      sites: [site('A', 400), site('B', 800, 500), site('C', 300)],
      measures: [measure],
      objective: 'fewest-participants',
    });
    expect(plan.status).toBe('infeasible');
    expect(plan.messages[0]).toBe('Site B needs 800 for its own targets, more than it can recruit.');
    expect(plan.sites.every((s) => s.n === null && s.setBy === null)).toBe(true);
  });
});
