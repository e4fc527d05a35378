import { formatDecimal } from '../../format/numbers';
import { zForConfidence } from '../numerics/distributions';
import { binaryGeneratingModel } from './binary-generating-model';
import { fitLogisticCalibration } from './fit-logistic-calibration';
import { mannWhitneyCStatistic } from './mann-whitney-c-statistic';
import { BINARY_BLOCK, simulateBinaryObservations } from './simulate-binary-observations';
import type { BinarySimulationConfig } from './simulation-config';
import type { MeasureDefinition, ReplicateOutcome, SimulationDesign } from './types';

/** Order of the binary measures in a ReplicateOutcome. */
export const BINARY_MEASURE = { observedExpected: 0, slope: 1, cStatistic: 2 } as const;

/**
 * Relative cost of a binary observation against a continuous one (a normal, a uniform and two
 * expit per draw, then about four Newton–Raphson passes and a sort; measured at about ten), so a step stays short.
 */
const BINARY_WORK_PER_OBSERVATION = 10;

function setMeasure(out: ReplicateOutcome, index: number, estimate: number, lower: number, upper: number, size: number): void {
  out.estimable[index] = 1;
  out.estimate[index] = estimate;
  out.lower[index] = lower;
  out.upper[index] = upper;
  out.size[index] = size;
}

/**
 * The binary-outcome validation study as a simulation design: each replicate draws n pairs
 * (LP, Y) from binaryGeneratingModel, then estimates
 * - O/E = (events/n) / mean expit(LP), with SE(ln O/E) = √((1 − O)/(n·O)) (delta method, E
 *   treated as fixed, as in the closed form: methods reference 5.1), interval O/E·exp(±z·SE),
 *   size = its multiplicative margin exp(z·SE) against the target margin;
 * - the calibration slope by Newton–Raphson logistic regression of Y on LP, Wald interval;
 * - the C-statistic by Mann–Whitney (sorting), Hanley–McNeil SE, Wald interval.
 * A replicate without events, without non-events, or whose logistic fit does not converge is
 * counted as not estimable for the measures it affects (never averaged as NaN).
 * Sources: [VAL-BIN] (Stat Med 2021;40(19):4230–4251, doi:10.1002/sim.9025) for the measures and
 * their closed forms; methods reference section 5.
 * @example createBinaryDesign(parseSimulationConfig(config)).measures.map((m) => m.id) // ['observed-expected', 'binary-slope', 'c-statistic']
 */
export function createBinaryDesign(config: BinarySimulationConfig): SimulationDesign {
  const { n, targets } = config;
  const model = binaryGeneratingModel(config.population);
  const z = zForConfidence(targets.confidence);
  const wald = `Wald, z = ${formatDecimal(z, 4)}`;
  const measures: MeasureDefinition[] = new Array<MeasureDefinition>(3);
  measures[BINARY_MEASURE.observedExpected] = {
    id: 'observed-expected',
    label: 'O/E (observed over expected events)',
    trueValue: model.observedExpected,
    scale: 'margin-factor',
    targetValue: targets.oe.marginFactor,
    interval: `log scale, ${wald}`,
  };
  measures[BINARY_MEASURE.slope] = {
    id: 'binary-slope',
    label: 'calibration slope',
    trueValue: model.calibration.slope,
    scale: 'ci-width',
    targetValue: targets.slope.width,
    interval: `${wald}, Newton–Raphson logistic fit`,
  };
  measures[BINARY_MEASURE.cStatistic] = {
    id: 'c-statistic',
    label: 'C-statistic',
    trueValue: model.cStatistic,
    scale: 'ci-width',
    targetValue: targets.cStatistic.width,
    interval: `${wald}, Hanley–McNeil SE`,
  };

  const lp = new Float64Array(n);
  const y = new Uint8Array(n);
  const scratchEvents = new Float64Array(n);
  const scratchNonEvents = new Float64Array(n);
  const normals = new Float64Array(BINARY_BLOCK);
  let filled = 0;
  let generated = 0;
  let events = 0;
  let predictedRisk = 0;

  const finish = (out: ReplicateOutcome): void => {
    out.estimable.fill(0);
    if (events > 0) {
      const observed = events / n;
      const oe = observed / (predictedRisk / n);
      const se = Math.sqrt((1 - observed) / (n * observed)); // SE(ln O/E) [VAL-BIN; methods reference 5.1]
      const margin = Math.exp(z * se);
      if (se > 0) setMeasure(out, BINARY_MEASURE.observedExpected, oe, oe / margin, oe * margin, margin);
    }
    const fit = fitLogisticCalibration(lp, y, n, model.calibration);
    if (fit.converged && fit.slopeSe > 0) {
      const half = z * fit.slopeSe;
      setMeasure(out, BINARY_MEASURE.slope, fit.slope, fit.slope - half, fit.slope + half, 2 * half);
    }
    const c = mannWhitneyCStatistic(lp, y, n, scratchEvents, scratchNonEvents);
    if (c !== null && c.se > 0) {
      const half = z * c.se;
      setMeasure(out, BINARY_MEASURE.cStatistic, c.c, c.c - half, c.c + half, 2 * half);
    }
  };

  return {
    n,
    measures,
    workPerObservation: BINARY_WORK_PER_OBSERVATION,
    begin: () => {
      filled = 0;
      generated = 0;
      events = 0;
      predictedRisk = 0;
    },
    simulate: (stream, count) => {
      // Data are drawn in whole blocks at fixed positions (normals for a block, then its
      // uniforms), possibly ahead of `filled`, so the draws do not depend on how the caller splits
      // the replicate between steps.
      const { lpMean, lpSd, calibrationIntercept, calibrationSlope } = config.population;
      const wanted = filled + count;
      while (generated < wanted) {
        const block = Math.min(BINARY_BLOCK, n - generated);
        const added = simulateBinaryObservations(
          stream,
          normals,
          lp,
          y,
          generated,
          block,
          lpMean,
          lpSd,
          calibrationIntercept,
          calibrationSlope,
        );
        generated += block;
        events += added.events;
        predictedRisk += added.predictedRisk;
      }
      filled = wanted;
    },
    finish,
  };
}
