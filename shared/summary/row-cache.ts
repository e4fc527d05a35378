// Edits replace one population and share the others (the document is immutable), so the rows of
// untouched populations can be reused: planning 200 populations on every keystroke would not keep
// an edit under the 50 ms budget. A row is reused only while its population, the project's
// updating settings and study window are the very same objects.
import type { Population, Project } from '../model/project';
import { comparisonRow, type ComparisonRow, type Planner } from './comparison';

interface Entry {
  readonly updating: Project['updating'];
  readonly study: Project['study'];
  readonly row: ComparisonRow;
}

export interface RowCache {
  rows(project: Project): ComparisonRow[];
}

export function createRowCache(planner: Planner): RowCache {
  const cache = new WeakMap<Population, Entry>();
  return {
    rows(project) {
      return project.populations.map((population) => {
        const hit = cache.get(population);
        if (hit !== undefined && hit.updating === project.updating && hit.study === project.study) return hit.row;
        const row = comparisonRow(population, project, planner);
        cache.set(population, { updating: project.updating, study: project.study, row });
        return row;
      });
    },
  };
}
