import type { z } from 'zod';

/** One problem found in user input: where it is (a readable path) and what is wrong. */
export interface FieldProblem {
  readonly path: string;
  readonly message: string;
}

/** A zod path as people read it: populations[2].anticipated.rSquared */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out === '' ? '(whole document)' : out;
}

/** Turns a zod error into field problems, each naming the field, the allowed range and the value. */
export function fieldProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.map((issue) => {
    const got = 'input' in issue && issue.input !== undefined ? ` (got ${JSON.stringify(issue.input)})` : '';
    return { path: formatPath(issue.path), message: `${issue.message}${got}` };
  });
}

/** All problems on one line each: `path: message`. */
export function describeProblems(problems: readonly FieldProblem[]): string {
  return problems.map((p) => `${p.path}: ${p.message}`).join('\n');
}
