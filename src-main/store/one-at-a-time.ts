// Runs tasks that share a key one after another, in the order they were asked for, so that two
// saves of the same file in this process finish in order (the later one wins) and a
// read-modify-write of a small list is not interleaved with another.
const tails = new Map<string, Promise<unknown>>();

export function oneAtATime<T>(key: string, task: () => Promise<T>): Promise<T> {
  const previous = tails.get(key) ?? Promise.resolve();
  const run = previous.then(task, task);
  const tail = run.then(
    () => undefined,
    () => undefined,
  );
  tails.set(key, tail);
  void tail.then(() => {
    if (tails.get(key) === tail) tails.delete(key);
  });
  return run;
}
