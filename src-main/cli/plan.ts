// Entry of the `plan` command, bundled by scripts/plan.mjs (which passes the demo path).
export { runPlan, EXIT_FAILURE, EXIT_INVALID, EXIT_OK } from './run-plan';
export type { PlanIo } from './run-plan';
