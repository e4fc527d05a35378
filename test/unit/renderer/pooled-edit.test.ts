import { describe, expect, it } from 'vitest';
import { applyPooledEdit } from '../../../src-renderer/src/state/pooled-edit';

describe('applyPooledEdit', () => {
  it('sets the aim on a plan that had no pooled settings, the rest taking the defaults', () => {
    expect(applyPooledEdit(undefined, 'aim', 'pooled')).toEqual({
      ok: true,
      pooled: { aim: 'pooled', objective: 'fewest-participants', confidence: 0.95, measures: {} },
    });
  });

  it('starts a τ range with the other end at τ, and removes it when an end is cleared', () => {
    const withTau = applyPooledEdit(undefined, 'measures.slope.tau', 0.05);
    if (!withTau.ok) throw new Error(withTau.message);
    const low = applyPooledEdit(withTau.pooled, 'measures.slope.tauRange.low', 0.02);
    expect(low.ok && low.pooled.measures.slope?.tauRange).toEqual({ low: 0.02, high: 0.05 });
    const high = applyPooledEdit(withTau.pooled, 'measures.slope.tauRange.high', 0.1);
    expect(high.ok && high.pooled.measures.slope?.tauRange).toEqual({ low: 0.05, high: 0.1 });
    if (!low.ok) throw new Error(low.message);
    const cleared = applyPooledEdit(low.pooled, 'measures.slope.tauRange.high', undefined);
    expect(cleared.ok && cleared.pooled.measures.slope).toEqual({ tau: 0.05 });
  });

  it('refuses a range before τ, and a range that leaves τ outside it, naming the field', () => {
    expect(applyPooledEdit(undefined, 'measures.citl.tauRange.low', 0.1)).toEqual({
      ok: false,
      message: 'give τ itself before its low–high range',
    });
    const start = applyPooledEdit(undefined, 'measures.slope.tau', 0.05);
    if (!start.ok) throw new Error(start.message);
    const outside = applyPooledEdit(
      { ...start.pooled, measures: { slope: { tau: 0.05, tauRange: { low: 0.02, high: 0.08 } } } },
      'measures.slope.tauRange.high',
      0.04,
    );
    expect(outside).toEqual({
      ok: false,
      message: 'between-site SD τ of the calibration slope must lie within its low–high range (got 0.05) (measures.slope.tau)',
    });
  });

  it('passes on the schema message for the field being edited', () => {
    expect(applyPooledEdit(undefined, 'measures.rSquared.summaryCiWidth', 2)).toEqual({
      ok: false,
      message: 'target width of the summary CI for the R² must be greater than 0 and at most 1 (got 2)',
    });
    expect(applyPooledEdit(undefined, 'objective', 'quickest')).toMatchObject({ ok: false });
  });

  it('drops a measure whose last value is cleared', () => {
    const start = applyPooledEdit(undefined, 'measures.slope.tau', 0.05);
    if (!start.ok) throw new Error(start.message);
    const cleared = applyPooledEdit(start.pooled, 'measures.slope.tau', undefined);
    expect(cleared.ok && cleared.pooled.measures).toEqual({});
  });
});
