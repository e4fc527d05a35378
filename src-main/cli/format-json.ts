import type { ProjectPlan } from '@shared/engine/plan/plan-project';
import type { ComparisonRow } from '@shared/summary/comparison';
import { CAUTIONS } from '@shared/text/cautions';
import { simulationJson } from './format-simulation';
import type { PopulationSimulation } from './simulate-populations';

/**
 * The --json output: `{ "populations": [ { "name", "requiredN", "binding", "criteria": [ { "id", "n" } ] } ] }`
 * with further fields in each object (status, label, target and reason per criterion; the
 * validation and development minimums, worst case, enrolment and precision at the available n per
 * population, and for binary outcomes the expected events at the required n as computed by the
 * planner, the events per parameter, the linear predictor used and the plan's warnings; the total
 * and the cautions at the top). With --simulate each population also has a `simulation` field (see
 * simulationJson).
 */
export function formatJson(
  plan: ProjectPlan,
  rows: readonly ComparisonRow[],
  simulations?: readonly PopulationSimulation[],
): string {
  const populations = plan.populations.map((p, i) => {
    const row = rows[i];
    return {
      name: p.name,
      requiredN: p.requiredN,
      binding: p.binding,
      criteria: p.criteria.map((c) => ({
        id: c.id,
        n: c.n,
        status: c.status,
        purpose: c.purpose,
        label: c.label,
        target: c.target,
        ...(c.reason === undefined ? {} : { reason: c.reason }),
      })),
      id: p.id,
      validationN: p.validationN,
      developmentN: p.developmentN,
      worstCase: p.worstCase,
      enrolmentTarget: row?.enrolmentTarget ?? null,
      monthsToRecruit: row?.months ?? null,
      availableN: p.availableN,
      precisionAtAvailableN: p.precisionAtAvailableN,
      problems: p.problems,
      events: p.events ?? null,
      eventsPerParameter: p.eventsPerParameter ?? null,
      lp: p.lp ?? null,
      warnings: p.warnings ?? [],
      ...(simulations === undefined ? {} : simulationField(simulations, p.id)),
    };
  });
  return `${JSON.stringify({ populations, totalRequiredN: plan.totalRequiredN, cautions: CAUTIONS }, null, 2)}\n`;
}

function simulationField(simulations: readonly PopulationSimulation[], id: string): { simulation?: Record<string, unknown> } {
  const s = simulations.find((x) => x.populationId === id);
  return s === undefined ? {} : { simulation: simulationJson(s) };
}
