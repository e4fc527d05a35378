// A new, empty plan: valid as it stands, so it can be saved (and autosaved) before anything is
// filled in. Every default comes from projectSchema itself, not from a second list here.
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema } from './project';
import type { OutcomeType, Project } from './project';

/** The name a new plan gets until the user gives it one. */
export const UNTITLED_PLAN_NAME = 'Untitled plan';

/**
 * A valid Project named "Untitled plan" with no populations, the given outcome type (continuous
 * unless asked; it can be changed until the first population is added), model updating off, and
 * the schema's defaults everywhere else.
 *
 * @example newEmptyProject('binary').outcome // 'binary'
 */
export function newEmptyProject(outcome: OutcomeType = 'continuous'): Project {
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: UNTITLED_PLAN_NAME,
    outcome,
    populations: [],
  });
}
