import { continuousPlanner } from '@shared/engine/plan/continuous-planner';
import type { Planner } from '@shared/summary/comparison';

/** The planner behind the command line's comparison rows (checked against the table's Planner). */
export const cliPlanner: Planner = continuousPlanner satisfies Planner;
