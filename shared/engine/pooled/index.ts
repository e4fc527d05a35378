// The pooled (across-sites) engine: random-effects summary precision, the prediction interval for a
// new site, heterogeneity floors, chart data, the one-more-site comparison, the pooled planner and
// the site-specific / pooled / both aims. Internal search pieces are not re-exported here.
export { randomEffectsSummary, type RandomEffectsSummary } from './random-effects-summary';
export { fixedEffectSummary, type FixedEffectSummary } from './fixed-effect-summary';
export { predictionInterval, type PredictionInterval } from './prediction-interval';
export { heterogeneityFloor, type HeterogeneityFloor } from './heterogeneity-floor';
export { minimumSites, MAX_SITES_SEARCHED, type MinimumSites, type SitesNeeded } from './minimum-sites';
export { pooledPrecision, PREDICTION_NEEDS_THREE_SITES, type PooledMeasurePrecision } from './pooled-precision';
export { widthsAt, type PooledWidths } from './widths-at';
export { widthAgainstSites, type WidthAgainstSitesInput } from './width-against-sites';
export { widthAgainstPerSiteN, type PerSiteNPoint, type WidthAgainstPerSiteNInput } from './width-against-per-site-n';
export {
  compareExtraSiteWithExtraParticipants,
  type ExtraSiteVersusParticipants,
  type ExtraSiteVersusParticipantsInput,
  type PerSiteIncrease,
  type PrecisionChange,
  type SiteAtN,
} from './extra-site-versus-extra-participants';
export {
  planPooledAllocation,
  PLANNER_OBJECTIVES,
  type PlannerObjective,
  type PooledPlan,
  type PooledPlanInput,
  type PooledPlanStatus,
  type SiteAllocation,
} from './plan-pooled-allocation';
export {
  planForAim,
  PLANNING_AIMS,
  type AimPlan,
  type AimPlanInput,
  type AimSite,
  type AimSiteResult,
  type PlanningAim,
} from './planning-aim';
export { POOLED_CAUTIONS } from './pooled-cautions';
export { MAX_SITE_N, type PlannerSite, type PooledMeasure, type PooledTarget, type SeAtN, type SiteCapacity } from './types';
