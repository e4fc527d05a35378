import { describe, expect, it } from 'vitest';
import { compareExtraSiteWithExtraParticipants } from '@shared/engine/pooled/extra-site-versus-extra-participants';
import { geometricGrid } from '@shared/engine/pooled/geometric-grid';
import { measureWeightings } from '@shared/engine/pooled/measure-weightings';
import { minimumSites } from '@shared/engine/pooled/minimum-sites';
import { widthAgainstPerSiteN } from '@shared/engine/pooled/width-against-per-site-n';
import { widthAgainstSites } from '@shared/engine/pooled/width-against-sites';
import { expectClose } from '../../helpers/expect-close';

const seA = (a: number) => (n: number) => Math.sqrt(a / n);

describe('one more site versus more participants per site', () => {
  it('with τ = 0 and SE² = a/n, 100 more participants help equally whether as a new site or spread (the summary depends only on Σn) [DERIVED]', () => {
    const r = compareExtraSiteWithExtraParticipants({
      label: 'CITL',
      sites: Array.from({ length: 4 }, () => ({ n: 100, seAtN: seA(1) })),
      tau: 0,
      newSite: { seAtN: seA(1), n: 100 },
      perSiteIncrease: { kind: 'count', count: 25 },
    });
    expect(r.extraSite.addedParticipants).toBe(100);
    expect(r.extraParticipants.addedParticipants).toBe(100);
    expectClose(r.extraSite.summaryCiWidth, r.extraParticipants.summaryCiWidth, 1e-12, 'equal widths');
    expect(r.moreEfficient).toBe('equal');
    expect(r.sentence).toContain('both narrow the summary CI equally');
  });

  it('with heterogeneity a new site is worth more than the same participants spread over the sites, and the sentence says so', () => {
    const r = compareExtraSiteWithExtraParticipants({
      label: 'Calibration slope',
      sites: Array.from({ length: 6 }, () => ({ n: 500, seAtN: seA(1) })),
      tau: 0.1,
      newSite: { seAtN: seA(1) },
    });
    expect(r.extraSite.newSiteN).toBe(500); // median of the current sites
    expect(r.extraParticipants.perSiteN).toEqual([550, 550, 550, 550, 550, 550]);
    expect(r.moreEfficient).toBe('extra-site');
    expect(r.extraSite.summaryRelativeChange).toBeLessThan(r.extraParticipants.summaryRelativeChange);
    expect(r.sentence).toMatch(
      /^Calibration slope: one more site with 500 participants changes the summary 95% CI width from 0\.\d+ to 0\.\d+ \(\d+(\.\d)?% narrower\)/,
    );
    expect(r.sentence).toContain('10% more participants at each of the 6 sites (300 in all)');
    expect(r.sentence).toContain('Per participant added, the extra site narrows the summary CI more.');
  });

  it('going from 2 to 3 sites makes the prediction interval available, and says so', () => {
    const r = compareExtraSiteWithExtraParticipants({
      label: 'O/E',
      sites: [
        { n: 300, seAtN: seA(9) },
        { n: 400, seAtN: seA(9) },
      ],
      tau: 0.1,
      newSite: { seAtN: seA(9) },
    });
    expect(r.current.predictionIntervalWidth).toBeNull();
    expect(r.extraSite.predictionIntervalWidth).not.toBeNull();
    expect(r.extraSite.predictionRelativeChange).toBeNull();
    expect(r.extraSite.newSiteN).toBe(350);
    expect(r.sentence).toContain('(available from 3 sites)');
  });
});

describe('chart data', () => {
  it('width against sites: identical sites give SE = √((s² + τ²)/K) [DERIVED]', () => {
    const points = widthAgainstSites({ seAtN: seA(4), n: 400, tau: 0.1, kFrom: 1, kTo: 12 });
    expect(points.map((p) => p.k)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    for (const p of points) expectClose(p.summarySe, Math.sqrt((0.01 + 0.01) / p.k), 1e-15, `K = ${p.k}`);
    expect(points[0]?.predictionIntervalWidth).toBeNull();
    expect(points[1]?.predictionIntervalWidth).toBeNull();
    expect(points[2]?.predictionIntervalWidth).not.toBeNull();
  });

  it('width against per-site n: a log-spaced whole-number grid with both ends', () => {
    const points = widthAgainstPerSiteN({ siteSeAtN: [seA(1), seA(2), seA(3)], tau: 0.05, nFrom: 50, nTo: 5000, points: 5 });
    expect(points.map((p) => p.n)).toEqual([50, 158, 500, 1581, 5000]);
    expect(geometricGrid(1, 3, 10)).toEqual([1, 2, 3]);
  });
});

describe('fewest sites and measure weightings', () => {
  it('minimumSites: 2·z·0.1/√K < 0.1 first at K = 16; a prediction target 0.5 at τ = 0.1 first at K = 8 (t_6 = 2.447, t-table)', () => {
    const r = minimumSites(0.1, { maxSummaryCiWidth: 0.1, maxPredictionIntervalWidth: 0.5 });
    expect(r.summary.sites).toBe(16);
    expect(r.prediction?.sites).toBe(8);
    expect(minimumSites(0, { maxSummaryCiWidth: 0.01 }).summary.sites).toBe(1);
    expect(minimumSites(0.1, { maxSummaryCiWidth: 1, maxPredictionIntervalWidth: 0.39 }).prediction?.sites).toBeNull();
  });

  it('measureWeightings: on the simplex, each measure alone included', () => {
    for (const m of [1, 2, 3, 4, 6]) {
      const ws = measureWeightings(m);
      for (const w of ws) {
        expect(w).toHaveLength(m);
        expectClose(
          w.reduce((a, b) => a + b, 0),
          1,
          1e-12,
          `weights sum, M = ${m}`,
        );
      }
      for (let j = 0; j < m; j++) expect(ws.some((w) => w[j] === 1)).toBe(true);
    }
    expect(measureWeightings(2)).toHaveLength(9);
    expect(measureWeightings(3)).toHaveLength(15);
  });
});
