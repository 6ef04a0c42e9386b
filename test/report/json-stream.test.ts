/**
 * The streamed JSON writer against the reference it promises to equal: JSON.stringify
 * with a 2-space indent (ECMA-262 §25.5.2, JSON.stringify with `space`), byte for byte.
 */
import { describe, expect, it } from 'vitest';
import { jsonLinesPieces, jsonPieces, LazyList } from '../../src/report/json-stream.js';

const joined = (pieces: Iterable<string>): string => [...pieces].join('');

const awkward = {
  a: 1,
  b: 'text with "quotes", a\nnewline and \u00e9',
  empty: {},
  none: [],
  skip: undefined,
  nested: { list: [1, null, { x: [[], {}, [1, [2, { y: 'z' }]]] }], flag: false },
  arr: [undefined, () => 1, -0, 1e21, Number.NaN, 'x'],
  big: Array.from({ length: 5 }, (_, i) => ({ i, v: [i, { w: i }] })),
};

describe('jsonPieces', () => {
  it('gives JSON.stringify(value, null, 2) + "\\n" at every opening depth', () => {
    for (const depth of [0, 1, 2, 3, 6]) {
      expect(joined(jsonPieces(awkward, depth))).toBe(JSON.stringify(awkward, null, 2) + '\n');
      expect(joined(jsonPieces([awkward, [], 'x'], depth))).toBe(JSON.stringify([awkward, [], 'x'], null, 2) + '\n');
      expect(joined(jsonPieces('just a string', depth))).toBe('"just a string"\n');
    }
  });

  it('writes a LazyList as the array it stands for, items made one at a time', () => {
    const items = awkward.big;
    let made = 0;
    const lazy = new LazyList(items.length, (i) => {
      made++;
      return items[i];
    });
    const doc = { head: 1, list: lazy, empty: new LazyList(0, () => 0), tail: [1] };
    const reference = { head: 1, list: items, empty: [], tail: [1] };
    expect(joined(jsonPieces(doc))).toBe(JSON.stringify(reference, null, 2) + '\n');
    expect(made).toBe(items.length);
    const deep = new LazyList(items.length, (i) => items[i], 2);
    expect(joined(jsonPieces({ deep }))).toBe(JSON.stringify({ deep: items }, null, 2) + '\n');
  });

  it('JSON Lines: one compact JSON.stringify per line (jsonlines.org)', () => {
    const items = [{ a: 1 }, { b: 'x\ny' }, [1, 2]];
    expect(joined(jsonLinesPieces(new LazyList(items.length, (i) => items[i])))).toBe(items.map((v) => JSON.stringify(v)).join('\n') + '\n');
  });
});
