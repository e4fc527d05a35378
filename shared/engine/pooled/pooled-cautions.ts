// Cautions that go with every pooled (across-sites) figure, beside the general cautions in
// shared/text/cautions.ts (statistical precision only; defer to ethics committees, regulators
// and local practice).

/** The approximations behind the pooled figures and what the planner must supply, in plain words. */
export const POOLED_CAUTIONS: readonly string[] = [
  'The between-site SD τ is an anticipated value: take it from earlier validations of this or similar models, or judge it; the pooled figures depend on it strongly, so look at them across its plausible range.',
  'Planning treats τ as known. The analysis will estimate τ from the sites, and its summary interval will usually be wider than planned, most of all with few sites.',
  'Per-site standard errors come from large-sample formulas at the planned n; sites with few participants or events may be less precise than shown.',
  'The prediction interval for a new site uses t with K − 2 degrees of freedom and needs at least 3 sites; with heterogeneity it cannot be narrower than 2·t·τ, however many participants are recruited.',
  'Widths are on the scale the measure is pooled on (the log scale for O/E).',
];
