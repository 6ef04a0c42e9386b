/** Plain-text tables for the terminal: columns aligned, numbers right-aligned. */

export interface Column {
  header: string;
  align?: 'left' | 'right';
}

export function renderTable(columns: Column[], rows: string[][]): string {
  const widths = columns.map((c, i) => {
    let w = c.header.length; // a loop, not a spread: a table may have a million rows
    for (const r of rows) w = Math.max(w, (r[i] ?? '').length);
    return w;
  });
  const line = (cells: string[]) =>
    cells
      .map((cell, i) => {
        const w = widths[i] ?? 0;
        return columns[i]?.align === 'right' ? cell.padStart(w) : cell.padEnd(w);
      })
      .join('  ')
      .trimEnd();
  const out = [line(columns.map((c) => c.header)), line(widths.map((w) => '-'.repeat(w)))];
  for (const r of rows) out.push(line(r));
  return out.join('\n');
}

/** Fixed decimals, with "-" for a missing value. */
export function fixed(value: number | undefined, decimals: number): string {
  if (value === undefined || !Number.isFinite(value)) return '-';
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text; // no "-0.00"
}

/** Bits in the unit a reader expects: Mbit, Gbit, Tbit. */
export function formatBits(bits: number): string {
  if (bits >= 1e12) return `${(bits / 1e12).toFixed(2)} Tbit`;
  if (bits >= 1e9) return `${(bits / 1e9).toFixed(2)} Gbit`;
  if (bits >= 1e6) return `${(bits / 1e6).toFixed(1)} Mbit`;
  if (bits >= 1e3) return `${(bits / 1e3).toFixed(1)} kbit`;
  return `${Math.round(bits)} bit`;
}
