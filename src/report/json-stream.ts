/**
 * JSON text in pieces, byte for byte what `JSON.stringify(value, null, 2) + '\n'` gives,
 * so a large document (plan.json with every contact) is written as it is made and never
 * held as one string. Objects and arrays are opened down to `depth`; below it each value
 * is one JSON.stringify call, re-indented (JSON never holds a raw newline inside a
 * string, so splitting on "\n" only meets the layout's own line breaks).
 * A `LazyList` is an array whose items are made one at a time while writing.
 */

/** An array made item by item while it is written (length known up front). */
export class LazyList<T = unknown> {
  constructor(
    readonly length: number,
    readonly at: (index: number) => T,
    /** Levels opened inside each item (0: one JSON.stringify per item, the fast way). */
    readonly itemDepth = 0,
  ) {}
}

/**
 * An array of items already rendered as JSON text (or its UTF-8 bytes) at the indentation
 * their place gives them (`pad`: the array's own indentation plus one level); written as
 * they are.
 */
export class RawList {
  constructor(
    readonly length: number,
    readonly at: (index: number) => string | Uint8Array,
    readonly itemPad: string,
  ) {}
}

const INDENT = '  ';

/** One value below the opened depth, re-indented to sit at `pad`. */
function leaf(value: unknown, pad: string): string | undefined {
  const text = JSON.stringify(value, null, 2);
  if (text === undefined) return undefined;
  return pad === '' || text.indexOf('\n') < 0 ? text : text.replace(/\n/g, `\n${pad}`);
}

function isOpenable(v: unknown): v is object {
  return v !== null && typeof v === 'object' && typeof (v as { toJSON?: unknown }).toJSON !== 'function' && !(v instanceof RawList);
}

function* rawItems(list: RawList, pad: string): Generator<string | Uint8Array> {
  if (list.length === 0) {
    yield '[]';
    return;
  }
  const inner = pad + INDENT;
  if (inner !== list.itemPad) throw new Error(`RawList rendered at ${JSON.stringify(list.itemPad)}, placed at ${JSON.stringify(inner)}`);
  yield '[';
  for (let i = 0; i < list.length; i++) {
    yield i === 0 ? `\n${inner}` : `,\n${inner}`;
    yield list.at(i);
  }
  yield `\n${pad}]`;
}

function* lazyItems(list: LazyList, pad: string): Generator<string | Uint8Array> {
  if (list.length === 0) {
    yield '[]';
    return;
  }
  const inner = pad + INDENT;
  yield '[';
  for (let i = 0; i < list.length; i++) {
    yield i === 0 ? `\n${inner}` : `,\n${inner}`;
    yield* piecesOf(list.at(i), inner, list.itemDepth, true);
  }
  yield `\n${pad}]`;
}

/** Pieces of `value` at indentation `pad`; `inArray`: undefined prints as null. */
function* piecesOf(value: unknown, pad: string, depth: number, inArray: boolean): Generator<string | Uint8Array> {
  if (value instanceof RawList) {
    yield* rawItems(value, pad);
    return;
  }
  if (value instanceof LazyList) {
    yield* lazyItems(value, pad);
    return;
  }
  if (depth <= 0 || !isOpenable(value)) {
    const text = leaf(value, pad);
    yield text ?? (inArray ? 'null' : '');
    return;
  }
  const inner = pad + INDENT;
  if (Array.isArray(value)) {
    if (value.length === 0) {
      yield '[]';
      return;
    }
    yield '[';
    for (let i = 0; i < value.length; i++) {
      yield i === 0 ? `\n${inner}` : `,\n${inner}`;
      yield* piecesOf(value[i], inner, depth - 1, true);
    }
    yield `\n${pad}]`;
    return;
  }
  let first = true;
  for (const key of Object.keys(value)) {
    const v = (value as Record<string, unknown>)[key];
    if (v === undefined || typeof v === 'function' || typeof v === 'symbol') continue;
    yield `${first ? '{' : ','}\n${inner}${JSON.stringify(key)}: `;
    first = false;
    yield* piecesOf(v, inner, depth - 1, false);
  }
  yield first ? '{}' : `\n${pad}}`;
}

/** The pieces of `JSON.stringify(value, null, 2) + '\n'`, objects and arrays opened to `depth`. */
export function* jsonPieces(value: unknown, depth = 3): Generator<string | Uint8Array> {
  yield* piecesOf(value, '', depth, false);
  yield '\n';
}

/** The pieces of a JSON Lines file: one `JSON.stringify(item)` per line. */
export function* jsonLinesPieces<T>(list: LazyList<T>): Generator<string> {
  for (let i = 0; i < list.length; i++) yield `${JSON.stringify(list.at(i))}\n`;
}

/** The pieces of a JSON Lines file whose lines are already rendered (each with its line end). */
export function* rawLinesPieces(list: RawList): Generator<string | Uint8Array> {
  for (let i = 0; i < list.length; i++) yield list.at(i);
}
