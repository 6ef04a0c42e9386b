/**
 * The report's own palette: warm paper, dark ink, one slate-teal accent, and
 * eight muted, mutually distinct hues for spacecraft (each readable as a thin
 * bar on the paper tone). Chosen for this report; not taken from any tool.
 */
export const PAPER = '#f4f1ea';
export const SURFACE = '#fffdf8';
export const INK = '#1d2127';
export const MUTED = '#646a72';
export const RULE = '#dcd6c8';
export const GRID = '#ebe6da';
export const ACCENT = '#2e5b63';
export const ACCENT_SOFT = '#9fbcbf';
export const WARN = '#9a3b2b';
export const GOOD = '#3d6b3a';

export const SPACECRAFT_HUES = ['#2f6a8c', '#b05e36', '#5a7d34', '#7a559a', '#a9821c', '#2f857a', '#a2445c', '#505a68'];

export const hueFor = (index: number): string => SPACECRAFT_HUES[index % SPACECRAFT_HUES.length] ?? INK;
