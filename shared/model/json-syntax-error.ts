// Where a piece of text stops being JSON. JSON.parse says only that it failed, and each JavaScript
// engine words (and places) the failure differently; a person repairing a damaged plan needs a
// line and a column. This scanner follows the grammar of RFC 8259 and is only run after
// JSON.parse has refused the text, so it is written for clarity rather than speed.

/** The first place where the text breaks the JSON grammar. Line and column count from 1. */
export interface JsonSyntaxError {
  /** Offset in UTF-16 code units (what String indexing uses). */
  readonly offset: number;
  readonly line: number;
  /** Column in characters (code points), so "é" or "😀" each count as one. */
  readonly column: number;
  /** What the grammar allowed at that point, in words. */
  readonly expected: string;
  /** What was there instead: a quoted character, or "the end of the text". */
  readonly found: string;
}

type Want = 'value' | 'value-or-close' | 'key' | 'key-or-close' | 'colon' | 'comma-or-close' | 'end';

const WANT_TEXT: Record<Want, string> = {
  value: 'a value',
  'value-or-close': "a value or ']'",
  key: 'a property name in double quotes',
  'key-or-close': "a property name in double quotes or '}'",
  colon: "':'",
  'comma-or-close': "',' or a closing bracket",
  end: 'the end of the text',
};

const isWhitespace = (c: number): boolean => c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d;
const isDigit = (c: number): boolean => c >= 0x30 && c <= 0x39;
const isHex = (c: number): boolean => isDigit(c) || (c >= 0x41 && c <= 0x46) || (c >= 0x61 && c <= 0x66);

/** A scan step either moves to `next` or stops at `error` with what was expected there. */
type Step = { readonly next: number } | { readonly error: number; readonly expected: string };

function scanString(text: string, start: number): Step {
  let i = start + 1;
  while (i < text.length) {
    const c = text.charCodeAt(i);
    if (c === 0x22) return { next: i + 1 };
    if (c < 0x20) return { error: i, expected: "a closing '\"' (control characters must be escaped)" };
    if (c === 0x5c) {
      const e = text.charCodeAt(i + 1);
      if (e === 0x75) {
        for (let k = 2; k < 6; k += 1) {
          if (!isHex(text.charCodeAt(i + k))) return { error: i + k, expected: 'four hexadecimal digits after \\u' };
        }
        i += 6;
        continue;
      }
      // " \ / b f n r t
      if ([0x22, 0x5c, 0x2f, 0x62, 0x66, 0x6e, 0x72, 0x74].includes(e)) {
        i += 2;
        continue;
      }
      return { error: i + 1, expected: 'a valid escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t or \\u)' };
    }
    i += 1;
  }
  return { error: text.length, expected: "a closing '\"'" };
}

function scanDigits(text: string, start: number, what: string): Step {
  let i = start;
  while (isDigit(text.charCodeAt(i))) i += 1;
  return i === start ? { error: start, expected: what } : { next: i };
}

function scanNumber(text: string, start: number): Step {
  let i = start;
  if (text.charCodeAt(i) === 0x2d) i += 1;
  if (text.charCodeAt(i) === 0x30) i += 1;
  else {
    const whole = scanDigits(text, i, 'a digit');
    if ('error' in whole) return whole;
    i = whole.next;
  }
  if (text.charCodeAt(i) === 0x2e) {
    const fraction = scanDigits(text, i + 1, "a digit after '.'");
    if ('error' in fraction) return fraction;
    i = fraction.next;
  }
  const e = text.charCodeAt(i);
  if (e === 0x65 || e === 0x45) {
    i += 1;
    const sign = text.charCodeAt(i);
    if (sign === 0x2b || sign === 0x2d) i += 1;
    const exponent = scanDigits(text, i, 'a digit in the exponent');
    if ('error' in exponent) return exponent;
    i = exponent.next;
  }
  return { next: i };
}

function scanScalar(text: string, start: number): Step {
  const c = text.charCodeAt(start);
  if (c === 0x22) return scanString(text, start);
  if (c === 0x2d || isDigit(c)) return scanNumber(text, start);
  const word = c === 0x74 ? 'true' : c === 0x66 ? 'false' : c === 0x6e ? 'null' : null;
  if (word === null) return { error: start, expected: 'a value' };
  for (let k = 1; k < word.length; k += 1) {
    if (text[start + k] !== word[k]) return { error: start + k, expected: `"${word}"` };
  }
  return { next: start + word.length };
}

function describeAt(text: string, offset: number): string {
  if (offset >= text.length) return 'the end of the text';
  const cp = text.codePointAt(offset) ?? 0;
  if (cp < 0x20) return `the control character U+${cp.toString(16).toUpperCase().padStart(4, '0')}`;
  return `'${String.fromCodePoint(cp)}'`;
}

function position(text: string, offset: number, expected: string): JsonSyntaxError {
  const before = text.slice(0, offset);
  const lineStart = before.lastIndexOf('\n') + 1;
  const line = before.split('\n').length;
  const column = Array.from(before.slice(lineStart)).length + 1;
  return { offset, line, column, expected, found: describeAt(text, offset) };
}

/**
 * Finds the first syntax error in `text` read as JSON (RFC 8259), or returns null when the text is
 * valid JSON. Iterative, so deeply nested input cannot overflow the stack.
 *
 * @example locateJsonSyntaxError('{\n  "a": 1,\n}') // { line: 3, column: 1, found: "'}'", expected: 'a property name in double quotes', offset: 12 }
 */
export function locateJsonSyntaxError(text: string): JsonSyntaxError | null {
  const open: ('object' | 'array')[] = [];
  let want: Want = 'value';
  let i = 0;
  const afterValue = (): Want => (open.length === 0 ? 'end' : 'comma-or-close');

  for (;;) {
    while (i < text.length && isWhitespace(text.charCodeAt(i))) i += 1;
    if (i >= text.length) return want === 'end' ? null : position(text, i, WANT_TEXT[want]);
    const c = text[i];

    if (want === 'end') return position(text, i, WANT_TEXT.end);
    if (want === 'colon') {
      if (c !== ':') return position(text, i, WANT_TEXT.colon);
      i += 1;
      want = 'value';
      continue;
    }
    if (want === 'comma-or-close') {
      const top = open[open.length - 1];
      const close = top === 'object' ? '}' : ']';
      if (c === ',') {
        i += 1;
        want = top === 'object' ? 'key' : 'value';
      } else if (c === close) {
        i += 1;
        open.pop();
        want = afterValue();
      } else return position(text, i, `',' or '${close}'`);
      continue;
    }
    if (want === 'key' || want === 'key-or-close') {
      if (want === 'key-or-close' && c === '}') {
        i += 1;
        open.pop();
        want = afterValue();
        continue;
      }
      if (c !== '"') return position(text, i, WANT_TEXT[want]);
      const key = scanString(text, i);
      if ('error' in key) return position(text, key.error, key.expected);
      i = key.next;
      want = 'colon';
      continue;
    }
    // want is 'value' or 'value-or-close'
    if (want === 'value-or-close' && c === ']') {
      i += 1;
      open.pop();
      want = afterValue();
      continue;
    }
    if (c === '{' || c === '[') {
      open.push(c === '{' ? 'object' : 'array');
      i += 1;
      want = c === '{' ? 'key-or-close' : 'value-or-close';
      continue;
    }
    const scalar = scanScalar(text, i);
    if ('error' in scalar) return position(text, scalar.error, scalar.expected === 'a value' ? WANT_TEXT[want] : scalar.expected);
    i = scalar.next;
    want = afterValue();
  }
}
