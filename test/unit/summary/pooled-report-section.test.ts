// The report's across-sites section: present for the pooled and both aims only, its sources
// numbered by the report's register (no inline DOIs), its figures those of the pooled summary.
import { describe, expect, it } from 'vitest';
import { continuousPlanner } from '@shared/engine/plan/continuous-planner';
import { planReport } from '@shared/report/plan-report';
import { renderText } from '@shared/report/render-text';
import { formatCount } from '@shared/format/numbers';
import { formatPooledWidth } from '@shared/summary/pooled-paragraph';
import { pooledReportSections } from '@shared/summary/pooled-report-section';
import { baseCase, pooledSummary } from '@shared/summary/pooled-summary';
import { plan } from './pooled-test-plans';

const clinics = [
  { id: 'a', accrualPerMonth: 60 },
  { id: 'b', accrualPerMonth: 35, rSquared: 0.35 },
  { id: 'c', availableN: 420, rSquared: 0.6 },
  { id: 'd', accrualPerMonth: 20 },
];
const slope = { tau: 0.05, tauRange: { low: 0.02, high: 0.08 }, summaryCiWidth: 0.2, predictionIntervalWidth: 0.7 };
const reproducibility = {
  appName: 'Plumbline',
  appVersion: 'test',
  fileName: null,
  contentHash: '0'.repeat(64),
  date: '2026-03-02',
};

describe('pooledReportSections', () => {
  it('gives no section for the site-specific aim', () => {
    expect(pooledReportSections(plan(clinics, { aim: 'site-specific', measures: { slope } }, 24))).toEqual([]);
  });

  it('gives the across-sites section with numbered sources, the figures and the proposal for the pooled aim', () => {
    const project = plan(clinics, { aim: 'pooled', measures: { slope } }, 24);
    const summary = pooledSummary(project);
    const doc = planReport({
      project,
      planner: continuousPlanner,
      extraSections: pooledReportSections(project),
      reproducibility,
    });
    const section = doc.sections.find((s) => s.id === 'across-sites');
    expect(section?.title).toBe('Precision across sites');
    const text = renderText(doc);
    expect(text).not.toContain('(doi:');
    expect(text).toMatch(/1\/\(SE² \+ τ²\) \[\d+\]/);
    expect(text).toContain('A re-evaluation of random-effects meta-analysis. J R Stat Soc A 2009');
    const base = baseCase(summary.measures[0]?.atPlanned ?? null)?.precision;
    expect(text).toContain(`summary 95% CI width of ${formatPooledWidth(base?.summaryCiWidth ?? null)}`);
    expect(summary.proposal?.status).toBe('feasible');
    const proposalTable = section?.blocks.flatMap((b) =>
      b.kind === 'table' && b.table.header[0] === 'Site' ? [b.table] : [],
    )[0];
    expect(proposalTable?.rows.map((r) => r[1])).toEqual(
      summary.proposal?.sites.map((s) => `${formatCount(s.n)}${s.atCapacity ? ' (at capacity)' : ''}`),
    );
    expect(section?.blocks.at(-1)).toMatchObject({ kind: 'paragraph', lead: 'Approximations.' });
  });
});
