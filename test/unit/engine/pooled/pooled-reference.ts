// Loads the scipy reference values (test/fixtures/pooled/pooled-reference.json, written by
// generate_pooled_fixtures.py beside it) and checks their shape with zod before any test uses them.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import type { SeAtN } from '@shared/engine/pooled/types';

const seParams = z.object({ a: z.number(), c: z.number(), b: z.number() });
export type SeParams = z.infer<typeof seParams>;

/** The fixture's parametric per-site SE: se(n) = √(a/(n − c) + b). */
export function seFrom(p: SeParams): SeAtN {
  return (n) => Math.sqrt(p.a / (n - p.c) + p.b);
}

const nullableNumber = z.number().nullable();

const summary = z.object({
  id: z.string(),
  siteSes: z.array(z.number()),
  tau: z.number(),
  confidence: z.number(),
  k: z.number(),
  z: z.number(),
  totalWeight: z.number(),
  summarySe: z.number(),
  summaryCiWidth: z.number(),
  fixedEffectSe: z.number(),
  summaryFloorAtK: z.number(),
  predictionFloorManySites: z.number(),
  t: nullableNumber,
  predictionHalfWidth: nullableNumber,
  predictionWidth: nullableNumber,
  predictionFloorAtK: nullableNumber,
});

const curvePoint = z.object({
  curve: z.string(),
  se: seParams,
  n: z.number(),
  tau: z.number(),
  k: z.number(),
  summaryCiWidth: z.number(),
  predictionIntervalWidth: z.number(),
});

const widthPair = z.object({ summaryCiWidth: z.number(), predictionIntervalWidth: nullableNumber });
const marginal = z.object({
  id: z.string(),
  sites: z.array(z.object({ n: z.number(), se: seParams })),
  tau: z.number(),
  newSite: z.object({ se: seParams, n: z.number() }),
  increase: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('fraction'), fraction: z.number() }),
    z.object({ kind: z.literal('count'), count: z.number() }),
  ]),
  current: widthPair,
  extraSite: widthPair.extend({ addedParticipants: z.number() }),
  extraParticipants: widthPair.extend({ addedParticipants: z.number(), perSiteN: z.array(z.number()) }),
});

const plan = z.object({
  id: z.string(),
  confidence: z.number(),
  sites: z.array(
    z.object({
      id: z.string(),
      minimumN: z.number(),
      capacity: z.number(),
      rate: z.number(),
      se: z.record(z.string(), seParams),
    }),
  ),
  measures: z.array(
    z.object({
      id: z.string(),
      tau: z.number(),
      maxSummaryCiWidth: z.number(),
      maxPredictionIntervalWidth: z.number().optional(),
    }),
  ),
  feasible: z.boolean(),
  minTotal: nullableNumber,
  minMonths: nullableNumber,
  minTotalAtMinMonths: nullableNumber,
});
export type ReferencePlan = z.infer<typeof plan>;

const reference = z.object({
  generator: z.string(),
  summaries: z.array(summary),
  sitesCurves: z.array(curvePoint),
  marginal: z.array(marginal),
  plans: z.array(plan),
});

const path = fileURLToPath(new URL('../../../fixtures/pooled/pooled-reference.json', import.meta.url));
export const POOLED_REFERENCE = reference.parse(JSON.parse(readFileSync(path, 'utf8')));
