// Numbered references in order of first use: the text asks for a citation mark while it is being
// written, and the reference list at the end is read back from the same register.
import { REFERENCES } from '../engine/references';
import type { ReferenceKey } from '../engine/types';
import type { NumberedReference } from './document';

/** Gives the citation mark for some references, e.g. "[1, 3]", numbering new ones as it goes. */
export type Cite = (keys: readonly ReferenceKey[]) => string;

export interface ReferenceRegister {
  readonly cite: Cite;
  /** The references cited so far, numbered in the order they were first cited. */
  list(): NumberedReference[];
}

/**
 * A fresh register. Unknown keys cannot occur (ReferenceKey is closed), and a key cited twice
 * keeps its first number. An empty list of keys gives an empty mark.
 * @example const r = createReferenceRegister(); r.cite(['VAL-CONT']) // "[1]"; r.cite(['DEV-CONT', 'VAL-CONT']) // "[2, 1]"
 */
export function createReferenceRegister(): ReferenceRegister {
  const order: ReferenceKey[] = [];
  const cite: Cite = (keys) => {
    if (keys.length === 0) return '';
    const numbers = [...new Set(keys)].map((key) => {
      let index = order.indexOf(key);
      if (index < 0) index = order.push(key) - 1;
      return index + 1;
    });
    return `[${numbers.join(', ')}]`;
  };
  return {
    cite,
    list: () => order.map((key, i) => ({ number: i + 1, citation: REFERENCES[key].citation })),
  };
}
