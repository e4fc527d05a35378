// A new, empty plan: valid as it stands, so it can be saved (and autosaved) before anything is
// filled in. Every default comes from projectSchema itself, not from a second list here.
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema } from './project';
import type { Project } from './project';

/** The name a new plan gets until the user gives it one. */
export const UNTITLED_PLAN_NAME = 'Untitled plan';

/**
 * A valid Project named "Untitled plan" with no populations, a continuous outcome (the only type
 * this version plans for), model updating off, and the schema's defaults everywhere else.
 *
 * @example newEmptyProject().populations // []
 */
export function newEmptyProject(): Project {
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: UNTITLED_PLAN_NAME,
    outcome: 'continuous',
    populations: [],
  });
}
