// The answer shape used wherever a failure must cross a boundary (IPC, the loopback host, a
// worker): a thrown error keeps only its message on the way, a result keeps its code too.

export interface Failure<C extends string = string> {
  readonly code: C;
  readonly message: string;
}

export type Result<T, C extends string = string> =
  { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: Failure<C> };
