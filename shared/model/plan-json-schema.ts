// The plan file format published as a JSON Schema (schema/plan.schema.json), so other tools can
// read and check plans without Plumbline. Generated from projectSchema, never written by hand:
// `npm run schema:write` rewrites the file, and a unit test fails when the file is out of date.
import { z } from 'zod';
import { FILE_EXTENSION, FORMAT_TAG, SCHEMA_VERSION, projectSchema } from './project';

/** Where the generated file lives, relative to the repository root. */
export const PLAN_JSON_SCHEMA_PATH = 'schema/plan.schema.json';

/**
 * The JSON Schema (draft 2020-12) of a plan file as it may be written: fields with defaults are
 * optional (zod's "input" view). Rules that JSON Schema cannot state, such as a range's low not
 * exceeding its high or a date being a real day, are checked by Plumbline on open.
 */
export function planJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(projectSchema, { io: 'input', target: 'draft-2020-12' });
  const { $schema, ...rest } = generated;
  return {
    $schema,
    title: `Plumbline plan file (${FILE_EXTENSION}), schema version ${SCHEMA_VERSION}`,
    description:
      `A sample-size plan for the external validation of a prediction model across several populations. ` +
      `Identified by "format": "${FORMAT_TAG}" and "schemaVersion": ${SCHEMA_VERSION}. ` +
      `Some rules (a range's low must not exceed its high, numbers must be finite, dates must be real days) ` +
      `are checked by Plumbline but cannot be expressed here. Generated from the application's schema; do not edit.`,
    ...rest,
  };
}

/** The file text: two-space indented JSON with a final newline. */
export function planJsonSchemaText(): string {
  return `${JSON.stringify(planJsonSchema(), null, 2)}\n`;
}
