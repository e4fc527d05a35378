import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { REFERENCES } from '@shared/engine/references';
import type { CriterionResult } from '@shared/engine/types';
import type { Project } from '@shared/model/project';
import { canonicalJson } from '@shared/report/canonical-json';
import { planContentHash } from '@shared/report/content-hash';
import { paragraph } from '@shared/report/document';
import { justificationDocument } from '@shared/report/plan-justification';
import { planReport } from '@shared/report/plan-report';
import { renderHtml } from '@shared/report/render-html';
import { escapeMarkdown, renderMarkdown } from '@shared/report/render-markdown';
import { renderText } from '@shared/report/render-text';
import type { Planner } from '@shared/summary/comparison';
import { enginePlanner } from '@shared/summary/planner';
import { demoProject } from './demo-plan';

const reproducibility = {
  appName: 'Plumbline',
  appVersion: 'test',
  fileName: 'plan.plumb',
  contentHash: 'ab'.repeat(32),
  date: '2026-01-15',
};

function citationNumbersInOrder(text: string): number[] {
  return [...text.matchAll(/\[(\d+(?:, \d+)*)\]/g)].flatMap((m) => (m[1] ?? '').split(', ').map(Number));
}

describe('references', () => {
  const text = renderText(justificationDocument({ project: demoProject(), planner: enginePlanner }));
  const body = text.slice(0, text.indexOf('\nReferences\n'));

  it('are numbered in order of first use: each new number is one more than the largest before it', () => {
    const numbers = citationNumbersInOrder(body);
    expect(numbers.length).toBeGreaterThan(0);
    let largest = 0;
    for (const n of numbers) {
      expect(n).toBeLessThanOrEqual(largest + 1);
      largest = Math.max(largest, n);
    }
  });

  it('list every cited number once with the full citation from the engine’s REFERENCES', () => {
    const largest = Math.max(...citationNumbersInOrder(body));
    const listed = text.slice(text.indexOf('\nReferences\n')).match(/^\[\d+\] .+$/gm) ?? [];
    expect(listed).toHaveLength(largest);
    const citations = new Set(Object.values(REFERENCES).map((r) => r.citation));
    for (const line of listed) expect(citations.has(line.replace(/^\[\d+\] /, ''))).toBe(true);
    expect(listed[0]).toBe(`[1] ${REFERENCES['VAL-CONT'].citation}`);
  });

  it('continue into sections a caller appends, which may cite too', () => {
    const doc = justificationDocument({
      project: demoProject(),
      planner: enginePlanner,
      extraSections: [
        (cite) => ({
          id: 'pooled',
          title: 'Pooled across sites',
          blocks: [paragraph(`Pooled by random effects ${cite(['HIGGINS-THOMPSON-SPIEGELHALTER-2009', 'VAL-CONT'])}.`)],
        }),
        { id: 'plain', title: 'A plain section', blocks: [paragraph('No citation here.')] },
      ],
    });
    const out = renderText(doc);
    expect(out).toContain('Pooled by random effects [5, 1].');
    expect(out).toContain(`[5] ${REFERENCES['HIGGINS-THOMPSON-SPIEGELHALTER-2009'].citation}`);
    expect(out.indexOf('A plain section')).toBeLessThan(out.indexOf('\nReferences\n'));
  });
});

describe('anticipated values and their sources', () => {
  const project = demoProject();
  const text = renderText(justificationDocument({ project, planner: enginePlanner }));

  it('quote each stated source and say "source not stated" where there is none', () => {
    for (const population of project.populations)
      for (const source of Object.values(population.sources)) expect(text).toContain(source.replace(/[.\s]+$/, ''));
    expect(text).toContain('Outcome variance: 0.81 outcome units² (source not stated)');
    expect(text).toContain('Anticipated R²: 0.28, range 0.22 to 0.34 (source: Invented: a pilot of 150 admissions)');
  });

  it('say when a default is used', () => {
    expect(text).toContain('R² for the CITL model: not stated, so the default is used (same as anticipated R²).');
  });
});

/** A planner giving fixed criteria in every status, as another outcome type's engine might. */
function plannerWith(criteria: CriterionResult[], requiredN: number | null, binding: string | null): Planner {
  return { plan: () => ({ criteria, requiredN, binding, precisionAtAvailableN: null }), worstCase: () => null };
}

const criterion = (over: Partial<CriterionResult>): CriterionResult => ({
  id: 'oe',
  label: 'Precise O/E (overall calibration)',
  purpose: 'validation',
  status: 'ok',
  n: 905,
  target: '95% CI for O/E within 0.9 to 1.1',
  formula: 'n = (1 − φ) / (φ·SE(ln O/E)²)',
  references: ['VAL-BIN'],
  intermediates: [{ name: 'SE(ln O/E)', value: 0.0510204 }],
  ...over,
});

describe('criteria of any outcome type', () => {
  const one = (planner: Planner): string => {
    const demo = demoProject();
    const population = demo.populations[0];
    if (population === undefined) throw new Error('no population');
    const project: Project = { ...demo, populations: [population] };
    return renderText(justificationDocument({ project, planner }));
  };

  it('read each status in words, with formula, intermediates and reference for sized ones', () => {
    const text = one(
      plannerWith(
        [
          criterion({}),
          criterion({
            id: 'c-statistic',
            label: 'Precise C-statistic',
            status: 'not-assessable',
            n: null,
            reason: 'needs the anticipated C-statistic',
            references: ['VAL-BIN', 'NEWCOMBE-2006'],
          }),
          criterion({
            id: 'net-benefit@0.1',
            label: 'Precise net benefit at threshold 0.1',
            status: 'not-converged',
            n: null,
            reason: 'the target is not reached below 100,000,000',
          }),
          criterion({
            id: 'slope',
            label: 'Precise calibration slope',
            status: 'always-met',
            n: 10,
            reason: 'the slope is exact',
          }),
        ],
        null,
        'net-benefit@0.1',
      ),
    );
    expect(text).toContain(
      'Precise O/E (overall calibration) (target: 95% CI for O/E within 0.9 to 1.1): n = 905, by the formula n = (1 − φ) / (φ·SE(ln O/E)²), with SE(ln O/E) = 0.05102 [1].',
    );
    expect(text).toContain(
      'Precise C-statistic (target: 95% CI for O/E within 0.9 to 1.1): not assessed (needs the anticipated C-statistic) [1, 2].',
    );
    expect(text).toContain('not reached (the target is not reached below 100,000,000); no sample size can be stated for it');
    expect(text).toContain('met at every admissible n, so its smallest admissible n, 10, is used (the slope is exact)');
    expect(text).toContain('No sample size can be stated for');
    expect(text).toContain(`[1] ${REFERENCES['VAL-BIN'].citation}`);
  });

  it('name a population that could not be planned, with the reason', () => {
    const failing: Planner = {
      plan: () => {
        throw new Error('a population with a binary outcome is not planned by the continuous engine');
      },
    };
    expect(one(failing)).toContain(
      'could not be planned: a population with a binary outcome is not planned by the continuous engine',
    );
  });
});

describe('renderings', () => {
  const demo = demoProject();
  const first = demo.populations[0];
  if (first === undefined) throw new Error('no population');
  const hostile: Project = {
    ...demo,
    name: 'Plan <script>alert(1)</script> | *bold*',
    populations: [{ ...first, name: 'Site </style><b>x</b> | y' }],
  };
  const doc = planReport({
    project: hostile,
    planner: enginePlanner,
    reproducibility: { ...reproducibility, fileName: 'a"b\\c</style>.plumb' },
  });

  it('HTML: A4 pages with repeated table headers, rows and figures kept whole, no script, every text escaped', () => {
    const html = renderHtml(doc);
    expect(html).toContain('size: A4');
    expect(html).toContain('thead { display: table-header-group; }');
    expect(html).toContain('tr { break-inside: avoid;');
    expect(html).toContain('figure { margin: 3mm 0 6mm; break-inside: avoid;');
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toContain('<b>x</b>');
    expect(html).toContain('Site &lt;/style&gt;&lt;b&gt;x&lt;/b&gt; | y');
    expect(html.match(/<\/style>/g)).toHaveLength(1);
    expect(html).toContain(`content: "Plumbline test · a\\"b\\\\c\\3c /style>.plumb · SHA-256 abababababababab…"`);
    expect(html).toContain("default-src 'none'");
    expect(html.match(/<svg /g)).toHaveLength(2);
  });

  it('Markdown: table cells and headings cannot be broken by names', () => {
    const md = renderMarkdown(doc);
    expect(md.startsWith('# Plan \\<script\\>alert(1)\\</script\\> \\| \\*bold\\*\n')).toBe(true);
    const first = doc.sections[0]?.blocks.find((b) => b.kind === 'table');
    const columns = first?.kind === 'table' ? first.table.header.length : 0;
    expect(columns).toBe(12);
    const row = md.split('\n').find((line) => line.startsWith('| 1 | Site'));
    // "| a | b |" splits into the cells plus an empty piece at each end; escaped pipes do not split.
    expect(row?.split(/(?<!\\)\|/)).toHaveLength(columns + 2);
    expect(escapeMarkdown('1. first')).toBe('1\\. first');
  });

  it('text: the reproducibility lines close the report', () => {
    const text = renderText(doc);
    expect(text.trimEnd().split('\n').slice(-3)).toEqual([
      'Made with Plumbline test on 2026-01-15.',
      'Plan file: a"b\\c</style>.plumb.',
      `SHA-256 of the plan’s canonical JSON (keys sorted, no spaces, defaults filled in): ${'ab'.repeat(32)}.`,
    ]);
  });
});

/** The same value with every object's keys in reverse order. */
function reverseKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reverseKeys);
  if (value !== null && typeof value === 'object')
    return Object.fromEntries(
      Object.entries(value as Record<string, unknown>)
        .reverse()
        .map(([k, v]) => [k, reverseKeys(v)]),
    );
  return value;
}

describe('content hash', () => {
  it('canonical JSON sorts keys at every level and drops undefined properties', () => {
    expect(canonicalJson({ b: 1, a: [true, null, 'x', { d: 2, c: undefined, b: 0.1 }] })).toBe(
      '{"a":[true,null,"x",{"b":0.1,"d":2}],"b":1}',
    );
    expect(() => canonicalJson({ a: Number.NaN })).toThrow('cannot hold the number NaN');
  });

  it('is SHA-256 of the canonical JSON, as computed by Node’s own crypto, whatever the key order', async () => {
    const project = demoProject();
    const reordered = reverseKeys(project) as Project;
    const expected = createHash('sha256').update(canonicalJson(project), 'utf8').digest('hex');
    expect(await planContentHash(project)).toBe(expected);
    expect(JSON.stringify(reordered)).not.toBe(JSON.stringify(project));
    expect(await planContentHash(reordered)).toBe(expected);
    expect(await planContentHash({ ...project, name: `${project.name}!` })).not.toBe(expected);
  });
});
