// Input shapes shared by the pooled (across-sites) functions. Every width and standard error is on
// the scale the per-site standard error is on: the log scale for O/E, the measure's own scale for
// the calibration slope, CITL, R² and the C statistic.

/** Per-site standard error of a measure's estimate as a function of the site's n. */
export type SeAtN = (n: number) => number;

/** Precision wanted for the random-effects summary of one measure across sites. */
export interface PooledTarget {
  /** Largest acceptable width of the summary confidence interval. */
  readonly maxSummaryCiWidth: number;
  /** Largest acceptable width of the prediction interval for a new site; omitted when none is wanted. */
  readonly maxPredictionIntervalWidth?: number;
}

/** One performance measure pooled across sites. */
export interface PooledMeasure {
  readonly id: string;
  readonly label: string;
  /** Anticipated between-site SD of the true site values (judged or taken from earlier validations), ≥ 0. */
  readonly tau: number;
  readonly target: PooledTarget;
}

/**
 * How many participants a site can recruit in the recruitment window: a whole number, or the
 * explicit word 'unlimited' (never assumed when the capacity is unknown). 'unlimited' is searched up
 * to MAX_SITE_N.
 */
export type SiteCapacity = number | 'unlimited';

/** The largest n the planner considers at one site (the project document's limit for a count). */
export const MAX_SITE_N = 100_000_000;

/** A site as the pooled planner sees it. */
export interface PlannerSite {
  readonly id: string;
  readonly capacity: SiteCapacity;
  /** Smallest n the site may be given (e.g. its own site-specific requirement when the aim is both). */
  readonly minimumN: number;
  /** Participants recruited per month; needed only for the shortest-recruitment objective. */
  readonly accrualPerMonth?: number;
  /** Per-site standard error at n, keyed by measure id; one entry per pooled measure. */
  readonly seAtN: Readonly<Record<string, SeAtN>>;
}
