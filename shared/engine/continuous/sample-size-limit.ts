/**
 * The largest sample size any criterion searches up to. A target that needs more is reported as
 * not reached (status not-converged, with the reason) instead of returning an astronomical or
 * non-finite number. The same bound as the largest cohort size a project may state.
 */
export const MAX_SAMPLE_SIZE = 100_000_000;

/** Reason text for a criterion whose target is out of reach below MAX_SAMPLE_SIZE. */
export const BEYOND_LIMIT_REASON =
  'the target would need more than 100,000,000 participants; widen the target or revisit the assumptions';
