import { enginePlanner } from '@shared/summary/planner';

/**
 * The planner behind the command line's comparison rows: the app's planner, which sends each
 * population to the continuous or binary engine by its outcome type and refuses (with the reason,
 * which the row shows) a population of another type than the plan's.
 */
export const cliPlanner = enginePlanner;
