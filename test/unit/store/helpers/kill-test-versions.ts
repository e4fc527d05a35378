// The two versions the crash test's child saves in turn. Different sizes, so a file cut short or
// mixed from both can never pass for either.
import { largePlan } from './large-plan';
import type { Project } from '@shared/model/project';

export const KILL_TEST_VERSIONS: readonly { readonly populations: number; readonly variant: string }[] = [
  { populations: 250, variant: 'A' },
  { populations: 400, variant: 'B' },
];

export function killTestPlans(): Project[] {
  return KILL_TEST_VERSIONS.map((v) => largePlan(v.populations, v.variant));
}
