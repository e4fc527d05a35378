// Reading and immutably replacing a value at a dot path ("precision.citl.width") in plain data.

export function getAt(value: unknown, path: string): unknown {
  let current: unknown = value;
  for (const key of path.split('.')) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<string, unknown>)[key];
  }
  return current;
}

/** A copy of `value` with `path` set to `next`; `undefined` removes the key. Untouched branches are shared. */
export function setAt<T>(value: T, path: string, next: unknown): T {
  const [head, ...rest] = path.split('.');
  if (head === undefined) return value;
  const source = (value ?? {}) as Record<string, unknown>;
  const child = rest.length === 0 ? next : setAt(source[head], rest.join('.'), next);
  const copy: Record<string, unknown> = { ...source };
  if (child === undefined) delete copy[head];
  else copy[head] = child;
  return copy as T;
}
