import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { PLAN_JSON_SCHEMA_PATH, planJsonSchema, planJsonSchemaText } from '@shared/model/plan-json-schema';
import { FORMAT_TAG, SCHEMA_VERSION } from '@shared/model/project';

const committedPath = fileURLToPath(new URL(`../../../${PLAN_JSON_SCHEMA_PATH}`, import.meta.url));

describe('schema/plan.schema.json', () => {
  it('is what projectSchema generates today (run `npm run schema:write` after changing the schema)', async () => {
    const committed = await readFile(committedPath, 'utf8');
    expect(committed).toBe(planJsonSchemaText());
  });

  it('pins the format tag and schema version, and requires the fields a plan cannot do without', () => {
    const schema = planJsonSchema() as {
      properties: Record<string, { const?: unknown; items?: { oneOf?: { required?: string[] }[] } }>;
      required: string[];
    };
    expect(schema.properties['format']?.const).toBe(FORMAT_TAG);
    expect(schema.properties['schemaVersion']?.const).toBe(SCHEMA_VERSION);
    expect(schema.required).toEqual(expect.arrayContaining(['format', 'schemaVersion', 'name', 'outcome', 'populations']));
    // fields with defaults are optional in a file (the "input" view), e.g. description
    expect(schema.required).not.toContain('description');
    // one population variant per outcome type: continuous needs its CITL width, binary targets all have defaults
    const [continuous, binary] = schema.properties['populations']?.items?.oneOf ?? [];
    expect(continuous?.required).toEqual(expect.arrayContaining(['id', 'name', 'outcome', 'anticipated', 'precision']));
    expect(binary?.required).toEqual(expect.arrayContaining(['id', 'name', 'outcome', 'anticipated']));
    expect(binary?.required).not.toContain('precision');
  });
});
