import type { Block } from './document';

/** Numbers tables and figures in the order a renderer meets them ("Table 1", "Figure 2"). */
export interface Numbering {
  next(block: Extract<Block, { kind: 'table' | 'figure' }>): string;
}

export function createNumbering(): Numbering {
  let tables = 0;
  let figures = 0;
  return {
    next(block) {
      if (block.kind === 'table') {
        tables += 1;
        return `Table ${tables}`;
      }
      figures += 1;
      return `Figure ${figures}`;
    },
  };
}
