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

const INDENT = '  ';

/** One value below the opened depth, re-indented to sit at `pad`. */
function leaf(value: unknown, pad: string): string | undefined {
  const text = JSON.stringify(value, null, 2);
  if (text === undefined) return undefined;
  return pad === '' || text.indexOf('\n') < 0 ? text : text.replace(/\n/g, `\n${pad}`);
}

function isOpenable(v: unknown): v is object {
  return v !== null && typeof v === 'object' && typeof (v as { toJSON?: unknown }).toJSON !== 'function';
}

function* lazyItems(list: LazyList, pad: string): Generator<string> {
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
function* piecesOf(value: unknown, pad: string, depth: number, inArray: boolean): Generator<string> {
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
export function* jsonPieces(value: unknown, depth = 3): Generator<string> {
  yield* piecesOf(value, '', depth, false);
  yield '\n';
}

/** The pieces of a JSON Lines file: one `JSON.stringify(item)` per line. */
export function* jsonLinesPieces<T>(list: LazyList<T>): Generator<string> {
  for (let i = 0; i < list.length; i++) yield `${JSON.stringify(list.at(i))}\n`;
}
