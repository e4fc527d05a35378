// Reading a population's stated values the way its field descriptions name them, so the report
// lists every anticipated value, target and recruitment figure with its label, unit, range and
// source, whatever the outcome type.
import { formatSignificant } from '../format/numbers';
import { CONTINUOUS_FIELDS, type FieldGroup, type FieldSpec } from '../model/population-fields';
import type { Population, Range } from '../model/project';

/** The field descriptions per outcome type; an outcome without a list is described by its keys. */
const FIELD_LISTS: Readonly<Partial<Record<string, readonly FieldSpec[]>>> = { continuous: CONTINUOUS_FIELDS };

const GROUPS: readonly FieldGroup[] = ['anticipated', 'precision', 'recruitment'];

/** Every number a population object holds under `prefix`, as dot paths (for outcomes with no field list). */
function numberPaths(value: unknown, prefix: string): string[] {
  if (typeof value === 'number') return [prefix];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value as Record<string, unknown>).flatMap(([key, inner]) => numberPaths(inner, `${prefix}.${key}`));
}

/** The field descriptions of a population: its outcome's list, or one plain entry per number it holds. */
export function fieldsFor(population: Population): readonly FieldSpec[] {
  const known = FIELD_LISTS[population.outcome];
  if (known !== undefined) return known;
  return GROUPS.flatMap((group) =>
    numberPaths((population as unknown as Record<string, unknown>)[group], group).map((path) => ({
      path,
      label: path.slice(group.length + 1),
      unit: '',
      allowed: '',
      required: false,
      group,
      help: '',
      ...(group === 'anticipated' ? { rangeKey: path.slice(group.length + 1) as FieldSpec['rangeKey'] } : {}),
    })),
  );
}

/** The value at a dot path ("precision.citl.width"), or undefined. */
export function valueAt(population: Population, path: string): unknown {
  return path
    .split('.')
    .reduce<unknown>(
      (node, key) => (node !== null && typeof node === 'object' ? (node as Record<string, unknown>)[key] : undefined),
      population,
    );
}

/** The low/high range stated for an anticipated value, if any. */
export function rangeOf(population: Population, spec: FieldSpec): Range | undefined {
  if (spec.rangeKey === undefined) return undefined;
  return (population.ranges as Readonly<Partial<Record<string, Range>>>)[spec.rangeKey];
}

/** The free-text source stated for an anticipated value, or null. */
export function sourceOf(population: Population, spec: FieldSpec): string | null {
  if (spec.rangeKey === undefined) return null;
  const text = population.sources[spec.rangeKey]?.trim();
  return text === undefined || text === '' ? null : text;
}

/** An entered value as written in the report: up to six significant digits, so what was typed is what is read. */
export function enteredNumber(value: number): string {
  return formatSignificant(value, 6);
}

/** A value with its unit, e.g. "0.64 outcome units²", "1.1×". */
export function withUnit(value: number, unit: string): string {
  if (unit === '') return enteredNumber(value);
  return unit === '×' ? `${enteredNumber(value)}×` : `${enteredNumber(value)} ${unit}`;
}
