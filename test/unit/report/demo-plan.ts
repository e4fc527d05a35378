// The bundled demo plan, read the way plan files are read (migrated and validated).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parsePlanText } from '@shared/model/plan-file';
import type { Project } from '@shared/model/project';

export const DEMO_PATH = path.resolve(import.meta.dirname, '..', '..', '..', 'demo', 'consortium-continuous.plumb');

export function demoProject(): Project {
  const parsed = parsePlanText(readFileSync(DEMO_PATH, 'utf8'));
  if (!parsed.ok) throw new Error(`the demo plan does not load: ${parsed.error.message}`);
  return parsed.project;
}

/** The demo with its first population copied until there are `count` (ids and names made unique). */
export function demoWithPopulations(count: number): Project {
  const demo = demoProject();
  const populations = Array.from({ length: count }, (_, i) => {
    const source = demo.populations[i % demo.populations.length];
    if (source === undefined) throw new Error('the demo has no populations');
    return { ...source, id: `${source.id}-${i + 1}`, name: `${source.name} ${i + 1}` };
  });
  return { ...demo, populations };
}
