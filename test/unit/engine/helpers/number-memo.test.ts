import { describe, expect, it } from 'vitest';
import { NumberMemo } from '@shared/engine/helpers/number-memo';

describe('number memo', () => {
  it('returns what was stored under one or two numbers and nothing for other keys', () => {
    const memo = new NumberMemo<string>();
    memo.set(0.95, 0, 'a');
    memo.set(1.1, 0.95, 'b');
    expect(memo.get(0.95)).toBe('a');
    expect(memo.get(1.1, 0.95)).toBe('b');
    expect(memo.get(1.1, 0.9)).toBeUndefined();
    expect(memo.get(0.9)).toBeUndefined();
    expect(memo.get(Number.NaN)).toBeUndefined();
  });

  it('keeps the 16 most recent keys: the oldest is replaced first', () => {
    const memo = new NumberMemo<number>();
    for (let i = 0; i < 20; i++) memo.set(i, 0, i * 10);
    for (let i = 0; i < 4; i++) expect(memo.get(i)).toBeUndefined();
    for (let i = 4; i < 20; i++) expect(memo.get(i)).toBe(i * 10);
  });
});
