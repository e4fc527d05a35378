// Invented plans for the across-sites tests (no real study): clinics with a continuous outcome.
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema, type Project } from '@shared/model/project';

export interface ClinicInput {
  readonly id: string;
  readonly rSquared?: number;
  readonly availableN?: number;
  readonly accrualPerMonth?: number;
  readonly eligibleFraction?: number;
  readonly consentFraction?: number;
  readonly missingOutcomeFraction?: number;
}

export function clinic(c: ClinicInput): Record<string, unknown> {
  return {
    id: c.id,
    name: `Clinic ${c.id}`,
    outcome: 'continuous',
    anticipated: { rSquared: c.rSquared ?? 0.5, outcomeVariance: 1 },
    precision: { citl: { width: 0.2 } },
    recruitment: {
      ...(c.availableN === undefined ? {} : { availableN: c.availableN }),
      ...(c.accrualPerMonth === undefined ? {} : { accrualPerMonth: c.accrualPerMonth }),
      ...(c.eligibleFraction === undefined ? {} : { eligibleFraction: c.eligibleFraction }),
      ...(c.consentFraction === undefined ? {} : { consentFraction: c.consentFraction }),
      ...(c.missingOutcomeFraction === undefined ? {} : { missingOutcomeFraction: c.missingOutcomeFraction }),
    },
  };
}

export function plan(clinics: readonly ClinicInput[], pooled: unknown, windowMonths?: number): Project {
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: 'Invented clinics',
    outcome: 'continuous',
    study: windowMonths === undefined ? {} : { windowMonths },
    pooled,
    populations: clinics.map(clinic),
  });
}
