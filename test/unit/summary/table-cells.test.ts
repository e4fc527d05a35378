import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { comparisonCells, toCsv, toTsv } from '@shared/summary/table-cells';
import type { ComparisonRow } from '@shared/summary/comparison';

const row = (name: string, n: number): ComparisonRow => ({
  populationId: name,
  name,
  criteria: [
    { id: 'r2', label: 'R²', purpose: 'validation', status: 'ok', n, target: '', formula: '', references: [], intermediates: [] },
  ],
  requiredN: n,
  binding: 'r2',
  bindingLabel: 'R²',
  missingOutcomeFraction: 0.1,
  enrolmentTarget: Math.ceil(n / 0.9),
  perMonth: 12.5,
  months: Math.ceil(n / 0.9) / 12.5,
  finishDate: '2028-01-01',
  feasibility: 'fits',
  worstCase: null,
  availableN: null,
  precisionAtAvailableN: null,
  problem: null,
});

describe('table cells, TSV and CSV', () => {
  const rows = [row('Harbour, "East" site', 762), row('Line\nbreak', 190)];
  const table = comparisonCells(rows, {
    populations: 2,
    enrolmentTarget: 847 + 212,
    longestMonths: 67.76,
    longestSite: 'Harbour',
    exceeding: 0,
    unplanned: 0,
  });

  it('keeps numbers as numbers and one column per criterion', () => {
    expect(table.header).toContain('R² (n)');
    expect(table.body[0]?.[2]).toBe(762);
    expect(table.body[0]?.[0]).toBe(1);
  });

  it('CSV round-trips through a standard RFC 4180 parser (csv-parse)', () => {
    const parsed: string[][] = parse(toCsv(table), { relax_column_count: false });
    expect(parsed).toHaveLength(4);
    expect(parsed[1]?.[1]).toBe('Harbour, "East" site');
    expect(parsed[2]?.[1]).toBe('Line\nbreak');
    expect(Number(parsed[1]?.[2])).toBe(762);
    expect(parsed[0]).toEqual(table.header);
  });

  it('TSV has one line per row with tabs between cells and no embedded breaks', () => {
    const lines = toTsv(table).split('\n').slice(0, -1);
    expect(lines).toHaveLength(4);
    expect(lines[2]?.split('\t')[1]).toBe('Line break');
    expect(lines.every((l) => l.split('\t').length === table.header.length)).toBe(true);
  });
});
