/**
 * The report's provenance footer: the input files with their SHA-256, each element set's
 * epoch and its age at the start of the span, the tool version, the options and the span.
 * No clock: the page says nothing about when it was made, so the same inputs give the same page.
 */
import type { InputFile } from '../../scenario/types.js';
import { isoUtc } from '../../time/format.js';
import { esc } from './escape.js';

export interface Provenance {
  toolVersion: string;
  inputs: readonly InputFile[];
  elementSets: readonly { spacecraftId: string; catalogNumber: string; epochMs: number }[];
  /** Options as the run took them, in words: [name, value]. */
  options: readonly (readonly [string, string])[];
  spanStartMs: number;
  spanEndMs: number;
}

/** Element sets older than this at the span start are marked (the contact search warns from 14 days too). */
const OLD_SET_DAYS = 14;

export function renderProvenance(p: Provenance): string {
  const files = p.inputs.map((f) => `<tr><td class="text">${esc(f.path)}</td><td>${f.bytes}</td><td class="text mono">${f.sha256}</td></tr>`).join('');
  const sets = p.elementSets
    .map((e) => {
      const ageD = (p.spanStartMs - e.epochMs) / 86_400_000;
      const old = Math.abs(ageD) > OLD_SET_DAYS;
      return `<tr><td>${esc(e.spacecraftId)}</td><td>${esc(e.catalogNumber)}</td><td class="text">${esc(isoUtc(e.epochMs, 3))}</td><td class="${old ? 'fail' : ''}">${ageD.toFixed(2)}</td></tr>`;
    })
    .join('');
  const opts = p.options.map(([k, v]) => `<div><dt>${esc(k)}</dt><dd>${esc(v)}</dd></div>`).join('');
  return [
    '<footer id="provenance"><h2>Provenance</h2>',
    `<dl class="prov">${[`<div><dt>tool</dt><dd>passbudget ${esc(p.toolVersion)}</dd></div>`, `<div><dt>span</dt><dd>${esc(isoUtc(p.spanStartMs, 0))} to ${esc(isoUtc(p.spanEndMs, 0))}</dd></div>`, opts].join('')}</dl>`,
    `<h3>Input files</h3><table class="prov-files"><thead><tr><th class="text">file</th><th>bytes</th><th class="text">SHA-256</th></tr></thead><tbody>${files}</tbody></table>`,
    sets
      ? `<h3>Element sets</h3><p class="note">Age: days from the epoch to the start of the span (negative: epoch after it); over ${OLD_SET_DAYS} days marked.</p><table class="prov-sets"><thead><tr><th>spacecraft</th><th>catalogue</th><th class="text">epoch (UTC)</th><th>age, days</th></tr></thead><tbody>${sets}</tbody></table>`
      : '',
    '<p class="note">Made by passbudget from the files above; the same inputs and options give the same page.</p>',
    '</footer>',
  ].join('\n');
}
