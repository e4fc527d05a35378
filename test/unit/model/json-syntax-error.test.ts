import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { locateJsonSyntaxError } from '@shared/model/json-syntax-error';

/** JSON.parse (the engine's own parser) is the reference for what is and is not JSON. */
function engineAccepts(text: string): boolean {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
}

describe('locateJsonSyntaxError', () => {
  it('returns null for valid JSON of every kind', () => {
    for (const text of [
      '{}',
      '[]',
      ' 0 ',
      '-0.5e+10',
      '"a\\u00e9\\n"',
      'true',
      'null',
      '{"a":[1,{"b":false}]}',
      '\n[\r\n1\t]\n',
    ]) {
      expect(locateJsonSyntaxError(text), text).toBeNull();
    }
  });

  it.each([
    ['{\n  "a": 1,\n}', 3, 1, "'}'", 'a property name in double quotes'],
    ['{"a" 1}', 1, 6, "'1'", "':'"],
    ['[1, 2,]', 1, 7, "']'", 'a value'],
    ['{"a": tru}', 1, 10, "'}'", '"true"'],
    ['{"a": 01}', 1, 8, "'1'", "',' or '}'"],
    ['{"a": 1.}', 1, 9, "'}'", "a digit after '.'"],
    ['{"a": "x', 1, 9, 'the end of the text', "a closing '\"'"],
    ['{"é": "😀", x', 1, 12, "'x'", 'a property name in double quotes'],
    ['', 1, 1, 'the end of the text', 'a value'],
    ['{} {}', 1, 4, "'{'", 'the end of the text'],
    ['["a\tb"]', 1, 4, 'the control character U+0009', "a closing '\"' (control characters must be escaped)"],
    ['["\\x"]', 1, 4, "'x'", 'a valid escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t or \\u)'],
  ])('%j breaks at line %i, column %i', (text, line, column, found, expected) => {
    expect(engineAccepts(text)).toBe(false);
    expect(locateJsonSyntaxError(text)).toMatchObject({ line, column, found, expected });
  });

  it('counts columns in characters: an emoji is two UTF-16 units but one column', () => {
    // x is the 6th character but sits at UTF-16 index 6 (a code-unit column would say 7)
    expect(locateJsonSyntaxError('["😀" x]')).toMatchObject({ offset: 6, column: 6 });
  });

  it('does not overflow the stack on deeply nested input', () => {
    const deep = '['.repeat(200_000);
    expect(locateJsonSyntaxError(deep)).toMatchObject({ offset: 200_000, found: 'the end of the text' });
  });

  it('agrees with JSON.parse on random valid JSON and on damaged copies of it', () => {
    const damaged = fc
      .tuple(
        fc.json(),
        fc.nat(),
        fc.constantFrom('delete', 'insert', 'truncate'),
        fc.constantFrom(...',:{}[]"\\ 0-.eE+tfnu\n'.split('')),
      )
      .map(([text, at, how, ch]) => {
        const k = text.length === 0 ? 0 : at % text.length;
        if (how === 'delete') return text.slice(0, k) + text.slice(k + 1);
        if (how === 'insert') return text.slice(0, k) + ch + text.slice(k);
        return text.slice(0, k);
      });
    fc.assert(
      fc.property(fc.oneof(fc.json(), damaged), (text) => {
        const located = locateJsonSyntaxError(text);
        expect(located === null, `${JSON.stringify(text)} → ${JSON.stringify(located)}`).toBe(engineAccepts(text));
      }),
      { numRuns: 3000 },
    );
  });
});
