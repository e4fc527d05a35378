// The report as data: a document of sections holding paragraphs, lists, tables, figures and the
// numbered references. One model, rendered by small functions to plain text, Markdown and a print
// HTML page (render-text.ts, render-markdown.ts, render-html.ts), so the three never disagree.

export interface ReportTable {
  readonly caption: string;
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
  /** A closing row (totals), printed once at the end, not repeated on each page. */
  readonly footer?: readonly string[];
  /** Per column: true when it holds numbers (right-aligned). */
  readonly numeric: readonly boolean[];
  /** A line under the table saying how to read it (marks, abbreviations). */
  readonly note?: string;
}

export interface ReportFigure {
  readonly caption: string;
  /** A complete <svg> element, with every text escaped (charts/*.ts). */
  readonly svg: string;
  /** What the figure shows, for readers who cannot see it and for the text renderings. */
  readonly description: string;
}

export interface NumberedReference {
  readonly number: number;
  readonly citation: string;
}

export type Block =
  | { readonly kind: 'paragraph'; readonly text: string; readonly lead?: string }
  | { readonly kind: 'list'; readonly items: readonly string[] }
  | { readonly kind: 'table'; readonly table: ReportTable }
  | { readonly kind: 'figure'; readonly figure: ReportFigure }
  | { readonly kind: 'references'; readonly items: readonly NumberedReference[] };

export interface ReportSection {
  /** A stable anchor, e.g. "population-harbour-general". */
  readonly id: string;
  readonly title: string;
  readonly blocks: readonly Block[];
  readonly subsections?: readonly ReportSection[];
}

/** What makes a printed report traceable to the plan it came from. */
export interface Reproducibility {
  readonly appName: string;
  readonly appVersion: string;
  /** The plan file's name, or null when the plan has not been saved. */
  readonly fileName: string | null;
  /** SHA-256 (hex) of the plan's canonical JSON (content-hash.ts). */
  readonly contentHash: string;
  /** When the report was made, YYYY-MM-DD. */
  readonly date: string;
}

export interface ReportDocument {
  readonly title: string;
  /** Lines under the title (the model, the number of populations, the date). */
  readonly subtitle: readonly string[];
  readonly sections: readonly ReportSection[];
  readonly reproducibility?: Reproducibility;
}

export const paragraph = (text: string, lead?: string): Block =>
  lead === undefined ? { kind: 'paragraph', text } : { kind: 'paragraph', text, lead };

export const list = (items: readonly string[]): Block => ({ kind: 'list', items });
