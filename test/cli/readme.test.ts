// The README's examples run as written: every "$ node dist/src/cli/main.js ..." line in an
// indented block of README.md is run with the built CLI (in a scratch folder holding the
// shipped examples/ and stations/, so files it writes stay out of the repository), and the lines shown
// under it must appear in its output (stderr, then stdout) in that order, each exactly
// (trailing blanks aside); a line "..." stands for any number of lines left out, and so
// do the lines before the first shown line and after the last.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const cliPath = join(repoRoot, 'dist', 'src', 'cli', 'main.js');
const PROMPT = '$ node dist/src/cli/main.js ';

export interface ReadmeExample {
  line: number;
  args: string[];
  shown: string[];
}

/** Words of a command line: blanks split, single or double quotes group. */
export function shellWords(text: string): string[] {
  const out: string[] = [];
  const re = /"([^"]*)"|'([^']*)'|(\S+)/g;
  for (let m = re.exec(text); m; m = re.exec(text)) out.push(m[1] ?? m[2] ?? m[3] ?? '');
  return out;
}

/** Every example: the command after the prompt and the indented lines under it, up to the end of the indented block or the next prompt. */
export function readmeExamples(markdown: string): ReadmeExample[] {
  const lines = markdown.split('\n');
  const out: ReadmeExample[] = [];
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    if (!l.startsWith(`    ${PROMPT}`)) continue;
    const args = shellWords(l.slice(4 + PROMPT.length));
    const shown: string[] = [];
    let j = i + 1;
    // the block runs on through blank lines followed by more indented lines
    const inBlock = (k: number): boolean => {
      const t = lines[k];
      if (t === undefined || t.startsWith(`    ${PROMPT}`)) return false;
      if (t.startsWith('    ')) return true;
      return t.trim() === '' && (lines[k + 1] ?? '').startsWith('    ') && !(lines[k + 1] ?? '').startsWith(`    ${PROMPT}`);
    };
    for (; j < lines.length && inBlock(j); j++) shown.push(lines[j]!.slice(4).trimEnd());
    out.push({ line: i + 1, args, shown });
    i = j - 1;
  }
  return out;
}

/** Where the shown lines fail to match the output in order, or undefined ("..." matches any run of lines). */
export function mismatch(shown: readonly string[], actual: readonly string[]): string | undefined {
  const act = actual.map((l) => l.trimEnd());
  // match segment by segment: each run of consecutive shown lines must appear consecutively, in order
  const segments: string[][] = [[]];
  for (const s of shown) {
    if (s === '...') segments.push([]);
    else segments[segments.length - 1]!.push(s);
  }
  let from = 0;
  for (let k = 0; k < segments.length; k++) {
    const seg = segments[k]!;
    if (seg.length === 0) continue;
    let at = -1;
    for (let p = from; p + seg.length <= act.length; p++) {
      if (seg.every((s, q) => act[p + q] === s)) {
        at = p;
        break;
      }
    }
    if (at < 0) return `not found in order: ${JSON.stringify(seg[0])}${seg.length > 1 ? ` (and ${seg.length - 1} lines after it)` : ''}`;
    from = at + seg.length;
  }
  return undefined;
}

describe('README examples', () => {
  const examples = readmeExamples(readFileSync(join(repoRoot, 'README.md'), 'utf8'));

  it('the README has examples for every command', () => {
    const commands = new Set(examples.map((e) => e.args[0]));
    for (const c of ['plan', 'trace', 'margin', 'budget', 'size', 'check', 'climate', 'schema', 'codes']) expect(commands, c).toContain(c);
  });

  it('the extractor keeps blank lines inside a block', () => {
    const ex = readmeExamples(['text', '', `    ${PROMPT}plan`, '    a', '', '    b', '', 'text'].join('\n'));
    expect(ex).toEqual([{ line: 3, args: ['plan'], shown: ['a', '', 'b'] }]);
  });

  it('the matcher itself: in order, "..." skips, a wrong line fails', () => {
    expect(mismatch(['a', '...', 'c'], ['a', 'b', 'c'])).toBeUndefined();
    expect(mismatch(['a', 'c'], ['a', 'b', 'c'])).toBeDefined();
    expect(mismatch(['c', '...', 'a'], ['a', 'b', 'c'])).toBeDefined();
    expect(mismatch(['...', 'b'], ['a', 'b', 'c'])).toBeUndefined();
    expect(mismatch(['a', 'x'], ['a', 'b', 'a', 'x'])).toBeUndefined();
    expect(mismatch(['b '], ['b'])).toBeDefined(); // shown lines are trimmed by the extractor, not here
  });

  const scratch = mkdtempSync(join(tmpdir(), 'pb-readme-'));
  symlinkSync(join(repoRoot, 'examples'), join(scratch, 'examples'));
  symlinkSync(join(repoRoot, 'stations'), join(scratch, 'stations'));
  for (const ex of examples) {
    it(`README line ${ex.line}: passbudget ${ex.args.join(' ')}`, () => {
      const r = spawnSync(process.execPath, [cliPath, ...ex.args], { cwd: scratch, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024, timeout: 240_000 });
      expect(r.status, r.stderr).not.toBe(70); // never a bug
      expect([0, 1, 2]).toContain(r.status);
      const lines = (t: string) => (t === '' ? [] : t.replace(/\n$/, '').split('\n'));
      const actual = [...lines(r.stderr), ...lines(r.stdout)];
      expect(mismatch(ex.shown, actual), `${r.stderr}\n${r.stdout}`.slice(0, 4000)).toBeUndefined();
    }, 240_000);
  }
});
