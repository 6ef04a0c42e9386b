/** Minimal RFC 4180 CSV reader for the reference copies in test/reference/ (quoted fields, commas inside quotes). */
import { readFileSync } from 'node:fs';

export function readCsv(url: URL): Record<string, string>[] {
  const text = readFileSync(url, 'utf8');
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i] as string;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i++;
        } else quoted = false;
      } else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') {
      row.push(field);
      field = '';
    } else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      row.push(field);
      field = '';
      if (row.some((f) => f !== '')) rows.push(row);
      row = [];
    } else field += ch;
  }
  if (field !== '' || row.length > 0) {
    row.push(field);
    rows.push(row);
  }
  const header = rows[0] ?? [];
  return rows.slice(1).map((r) => Object.fromEntries(header.map((h, j) => [h, r[j] ?? ''])));
}

/** URL of a file in test/reference/modcod/ (resolved from this helper's location, test/link/). */
export function modcodRef(name: string): URL {
  return new URL(`../reference/modcod/${name}`, import.meta.url);
}
