// Deterministic plans of any size for the storage tests and the benchmark: every population is
// filled in (ranges, sources, notes, recruitment) so the file is as large as a real one would be.
// The scenario is invented.
import { FORMAT_TAG, SCHEMA_VERSION, projectSchema } from '@shared/model/project';
import type { Project } from '@shared/model/project';

/**
 * A valid plan with `populations` populations. `variant` changes every population's name and
 * numbers, so two variants of the same size differ throughout the file.
 */
export function largePlan(populations: number, variant: string): Project {
  const shift = [...variant].reduce((sum, ch) => sum + ch.charCodeAt(0), 0) % 17;
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: `Synthetic consortium ${variant} (${populations} sites)`,
    description: `Generated for storage tests, variant ${variant}. Not a real study.`,
    outcome: 'continuous',
    model: {
      name: 'Synthetic recovery-time score',
      reportedPerformance: 'R² 0.40 at development (invented)',
      reportedRSquared: 0.4,
    },
    updating: { enabled: true, predictorParameters: 12, anticipatedAdjustedRSquared: 0.3 },
    study: { startDate: '2032-01-15', windowMonths: 24 },
    populations: Array.from({ length: populations }, (_, i) => {
      const r2 = 0.2 + ((i + shift) % 40) / 200;
      return {
        id: `site-${variant}-${i}`,
        name: `Site ${i + 1} — Région ${variant} ü`,
        notes: `Variant ${variant}, site ${i + 1}. Accrual estimated from a made-up audit of ${100 + i} patients.`,
        outcome: 'continuous',
        anticipated: {
          rSquared: r2,
          outcomeVariance: 50 + ((i * 7 + shift) % 60),
          slope: 1,
          outcomeMean: 20 + (i % 9),
          outcomeSd: 7.5,
        },
        ranges: { rSquared: { low: r2 - 0.1, high: r2 + 0.05 }, outcomeVariance: { low: 40, high: 130 } },
        sources: { rSquared: 'judgement', outcomeVariance: `pilot data, site ${i + 1}` },
        precision: { confidence: 0.95, rSquared: { width: 0.1 }, citl: { width: 1.5 + (i % 5) / 10 }, slope: { width: 0.2 } },
        recruitment: {
          accrualPerMonth: 10 + (i % 30),
          eligibleFraction: 0.8,
          consentFraction: 0.75,
          missingOutcomeFraction: 0.05,
        },
      };
    }),
  });
}
