/** Entries kept; the oldest is replaced when full. Planning uses a handful of levels and margins. */
const CAPACITY = 16;

/**
 * Remembers values of a pure function of one or two numbers (a confidence level, a margin), for
 * the few keys a plan uses. A linear scan over at most 16 entries compares numbers directly,
 * which is several times cheaper than a Map keyed by doubles on the hot path of a sweep; when
 * full, the oldest entry is replaced. Keys are compared with ===, so NaN is never found.
 * Common practice (memoisation).
 * @example const m = new NumberMemo<number>(); m.set(0.95, 0, 1.96); m.get(0.95) // 1.96
 */
export class NumberMemo<V> {
  private readonly first = new Float64Array(CAPACITY);
  private readonly second = new Float64Array(CAPACITY);
  private readonly values: V[] = [];
  private next = 0;
  /** The slot found last: consecutive calls usually ask for the same key again. */
  private last = 0;

  get(a: number, b = 0): V | undefined {
    const l = this.last;
    if (this.first[l] === a && this.second[l] === b && l < this.values.length) return this.values[l];
    for (let i = 0; i < this.values.length; i++) {
      if (this.first[i] === a && this.second[i] === b) {
        this.last = i;
        return this.values[i];
      }
    }
    return undefined;
  }

  set(a: number, b: number, value: V): void {
    const slot = this.values.length < CAPACITY ? this.values.length : this.next;
    this.first[slot] = a;
    this.second[slot] = b;
    this.values[slot] = value;
    this.next = (slot + 1) % CAPACITY;
    this.last = slot;
  }
}
