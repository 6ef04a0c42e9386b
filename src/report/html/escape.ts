/** HTML escaping and small number formatters shared by the report's parts. */

/** Escapes text for element content and double-quoted attribute values. */
export function esc(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** A coordinate with one decimal, no trailing ".0" (keeps the file small and stable). */
export function px(v: number): string {
  const r = Math.round(v * 10) / 10;
  return Object.is(r, -0) ? '0' : String(r);
}

/** "HH:MM" UTC of an instant. */
export function hhmmUtc(tMs: number): string {
  return new Date(Math.round(tMs / 1000) * 1000).toISOString().slice(11, 16);
}

/** "Thu 05 Mar" of a UTC day start. */
export function dayLabelUtc(tMs: number): string {
  const d = new Date(tMs);
  const wd = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'][d.getUTCDay()] ?? '';
  const mo = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'][d.getUTCMonth()] ?? '';
  return `${wd} ${String(d.getUTCDate()).padStart(2, '0')} ${mo}`;
}
