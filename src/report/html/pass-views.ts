/**
 * Views of the passes that matter (plan/series.ts passesThatMatter): a polar sky plot of
 * the azimuth / elevation track over the station's horizon mask (north up, east right,
 * the zenith at the centre, the horizon at the rim), the closure margin and the MODCOD in
 * use over time, and the pass's warnings (plan/pass-warnings.ts).
 */
import { maskElevationDeg, prepareMask } from '../../geometry/mask.js';
import type { PassWarning } from '../../plan/pass-warnings.js';
import type { ContactSeries } from '../../plan/series.js';
import type { Contact } from '../../plan/types.js';
import type { Mask } from '../../scenario/types.js';
import { formatDuration, isoUtc } from '../../time/format.js';
import { fixed, formatBits } from '../table.js';
import { niceStep, timeStepMs } from './axis.js';
import { hhmmssUtc } from './days.js';
import { dayLabelUtc, esc, hhmmUtc, px } from './escape.js';

export interface PassView {
  contact: Contact;
  why: string[];
  series: ContactSeries;
  mask: Mask;
  warnings: PassWarning[];
}

const SKY = 240;
const SKY_R = 100;
const SKY_C = SKY / 2;
const DEG = Math.PI / 180;

/** Plot coordinates of a direction: radius (90 - elevation), azimuth clockwise from north. */
function skyXY(azDeg: number, elDeg: number): [number, number] {
  const r = (SKY_R * (90 - Math.max(0, Math.min(90, elDeg)))) / 90;
  return [SKY_C + r * Math.sin(azDeg * DEG), SKY_C - r * Math.cos(azDeg * DEG)];
}

function skyPlot(v: PassView, id: string): string {
  const s = v.series;
  const out: string[] = [];
  out.push(`<svg class="sky" viewBox="0 0 ${SKY} ${SKY}" role="img" aria-labelledby="${id}-t"><title id="${id}-t">Sky track of ${esc(s.spacecraftId)} over ${esc(s.stationId)} from ${esc(isoUtc(s.aosMs, 0))}, with the horizon mask</title>`);
  out.push(`<circle class="sky-rim" cx="${SKY_C}" cy="${SKY_C}" r="${SKY_R}" data-r="${SKY_R}"/>`);
  for (const el of [30, 60]) out.push(`<circle class="grid" fill="none" cx="${SKY_C}" cy="${SKY_C}" r="${px((SKY_R * (90 - el)) / 90)}"/>`);
  out.push(`<line class="grid" x1="${SKY_C - SKY_R}" y1="${SKY_C}" x2="${SKY_C + SKY_R}" y2="${SKY_C}"/><line class="grid" x1="${SKY_C}" y1="${SKY_C - SKY_R}" x2="${SKY_C}" y2="${SKY_C + SKY_R}"/>`);
  // the mask: the ring between the horizon and the mask elevation, shaded
  const pm = prepareMask(v.mask);
  const inner: string[] = [];
  for (let az = 0; az <= 360; az += 2) {
    const [x, y] = skyXY(az, maskElevationDeg(pm, az % 360));
    inner.push(`${px(x)},${px(y)}`);
  }
  const outer: string[] = [];
  for (let az = 360; az >= 0; az -= 2) {
    const [x, y] = skyXY(az, 0);
    outer.push(`${px(x)},${px(y)}`);
  }
  out.push(`<polygon class="sky-mask" points="${inner.join(' ')} ${outer.join(' ')}"><title>horizon mask</title></polygon>`);
  for (const [label, az] of [['N', 0], ['E', 90], ['S', 180], ['W', 270]] as const) {
    const [x, y] = skyXY(az, -9);
    out.push(`<text x="${px(x)}" y="${px(y + 4)}" text-anchor="middle">${label}</text>`);
  }
  out.push(`<text x="${SKY_C + 3}" y="${px(SKY_C - (SKY_R * 60) / 90 + 11)}">30°</text><text x="${SKY_C + 3}" y="${px(SKY_C - (SKY_R * 30) / 90 + 11)}">60°</text>`);
  const pts: string[] = [];
  for (let i = 0; i < s.tMs.length; i++) {
    const [x, y] = skyXY(s.azimuthDeg[i]!, s.elevationDeg[i]!);
    pts.push(`${px(x)},${px(y)}`);
  }
  out.push(`<polyline class="sky-track" points="${pts.join(' ')}"/>`);
  pts.forEach((p, i) => {
    const [x, y] = p.split(',');
    const cls = s.rateBps[i]! > 0 ? 'sky-pt data' : 'sky-pt';
    out.push(`<circle class="${cls}" cx="${x}" cy="${y}" r="1.7"/>`);
  });
  const first = pts[0]?.split(',');
  const last = pts[pts.length - 1]?.split(',');
  if (first) out.push(`<text class="lbl" x="${first[0]}" y="${Number(first[1]) - 5}" text-anchor="middle">AOS</text>`);
  if (last) out.push(`<text class="lbl" x="${last[0]}" y="${Number(last[1]) - 5}" text-anchor="middle">LOS</text>`);
  out.push('</svg>');
  return out.join('');
}

const W = 560;
const LEFT = 46;
const RIGHT = 10;
const TOP = 16;
const MARGIN_H = 96;
const GAP = 26;
const STRIP_H = 16;
const BOTTOM = 26;
const H = TOP + MARGIN_H + GAP + STRIP_H + BOTTOM;
const MODCOD_SHADES = ['mc0', 'mc1', 'mc2', 'mc3'];

function marginChart(v: PassView, id: string): string {
  const s = v.series;
  const t0 = s.aosMs;
  const t1 = Math.max(s.losMs, t0 + 1000);
  const x = (t: number) => LEFT + ((t - t0) / (t1 - t0)) * (W - LEFT - RIGHT);
  const finite = Array.from(s.marginDb).filter(Number.isFinite);
  const lo = Math.min(0, ...finite);
  const hi = Math.max(1, ...finite);
  const step = niceStep(hi - lo, 4);
  const yLo = Math.floor(lo / step) * step;
  const yHi = Math.ceil(hi / step) * step;
  const y = (m: number) => TOP + MARGIN_H - ((Math.min(Math.max(m, yLo), yHi) - yLo) / (yHi - yLo)) * MARGIN_H;
  const out: string[] = [];
  out.push(`<svg viewBox="0 0 ${W} ${H}" role="img" aria-labelledby="${id}-m"><title id="${id}-m">Closure margin and MODCOD of ${esc(s.spacecraftId)} over ${esc(s.stationId)} from ${esc(isoUtc(s.aosMs, 0))}</title>`);
  for (let m = yLo; m <= yHi + 1e-9; m += step) {
    out.push(`<line class="${Math.abs(m) < 1e-9 ? 'axis' : 'grid'}" x1="${LEFT}" y1="${px(y(m))}" x2="${W - RIGHT}" y2="${px(y(m))}"/>`);
    out.push(`<text x="${LEFT - 5}" y="${px(y(m) + 3.5)}" text-anchor="end">${Number(m.toFixed(2))}</text>`);
  }
  const line: string[] = [];
  for (let i = 0; i < s.tMs.length; i++) if (Number.isFinite(s.marginDb[i]!)) line.push(`${px(x(s.tMs[i]!))},${px(y(s.marginDb[i]!))}`);
  out.push(`<polyline class="margin-line" points="${line.join(' ')}"/>`);
  out.push(`<text class="lbl" x="${LEFT + 4}" y="${TOP - 4}">closure margin, dB (0: the most robust entry with the required margin)</text>`);
  // MODCOD strip: one segment per run of the same entry
  const yS = TOP + MARGIN_H + GAP;
  out.push(`<text class="lbl" x="${LEFT + 4}" y="${yS - 4}">MODCOD in use</text>`);
  let runStart = 0;
  let shade = 0;
  for (let i = 1; i <= s.tMs.length; i++) {
    if (i < s.tMs.length && s.modcodIndex[i] === s.modcodIndex[runStart]) continue;
    const idx = s.modcodIndex[runStart]!;
    const xa = x(s.tMs[runStart]!);
    const xb = x(s.tMs[Math.min(i, s.tMs.length - 1)]!);
    const name = idx >= 0 ? (s.modcodNames[idx] ?? '?') : 'none closes';
    const cls = idx >= 0 ? MODCOD_SHADES[shade++ % MODCOD_SHADES.length] : 'mc-none';
    out.push(`<rect class="${cls}" x="${px(xa)}" y="${yS}" width="${px(Math.max(0.5, xb - xa))}" height="${STRIP_H}"><title>${esc(name)}: ${hhmmssUtc(s.tMs[runStart]!)} to ${hhmmssUtc(s.tMs[Math.min(i, s.tMs.length - 1)]!)}</title></rect>`);
    if (xb - xa > 7 * name.length) out.push(`<text class="mc-lbl" x="${px((xa + xb) / 2)}" y="${yS + 11.5}" text-anchor="middle">${esc(name)}</text>`);
    runStart = i;
  }
  const stepMs = timeStepMs(t1 - t0, 6);
  const long = t1 - t0 > 86_400_000;
  for (let t = Math.ceil(t0 / stepMs) * stepMs; t <= t1; t += stepMs) {
    const label = long && t % 86_400_000 === 0 ? dayLabelUtc(t) : hhmmUtc(t);
    if (x(t) <= W - RIGHT - 3.5 * label.length) out.push(`<text x="${px(x(t))}" y="${yS + STRIP_H + 14}" text-anchor="middle">${label}</text>`);
  }
  out.push(`<text x="${W - RIGHT}" y="${H - 2}" text-anchor="end">UTC</text></svg>`);
  return out.join('');
}

export function renderPassViews(views: readonly PassView[]): string {
  if (views.length === 0) return '<p class="note">No contact in this plan.</p>';
  const parts = ['<div class="passes">'];
  views.forEach((v, i) => {
    const c = v.contact;
    const l = c.link;
    const facts = [
      `${esc(isoUtc(c.aosMs, 0))} to ${esc(isoUtc(c.losMs, 0))}`,
      `${formatDuration(c.durationS)}, max elevation ${c.maxElevationDeg.toFixed(1)} deg`,
      l ? `data ${hhmmssUtc(l.dataStartMs)} to ${hhmmssUtc(l.dataEndMs)}, ${formatBits(l.volumeBits)}, closure margin down to ${fixed(l.worstMarginDb, 1)} dB` : 'no link computed',
    ];
    const notes: string[] = v.warnings.map((w) => `<li class="flag">${hhmmssUtc(w.atMs)}: ${esc(w.text)}</li>`);
    if (l && l.worstMarginDb < 0) notes.push(`<li class="flag">the link does not close for part of the pass (margin ${fixed(l.worstMarginDb, 1)} dB at ${hhmmssUtc(l.worstMarginAtMs)}, ${l.worstMarginElevationDeg.toFixed(1)} deg elevation)</li>`);
    if (c.aosClipped || c.losClipped) notes.push('<li>window cut by the span</li>');
    parts.push(
      `<article class="pass-view" data-station="${esc(c.stationId)}" data-spacecraft="${esc(c.spacecraftId)}">` +
        `<h3>${esc(v.why.join(' · '))}: ${esc(c.spacecraftId)} over ${esc(c.stationId)}</h3><p class="meta">${facts.join(' · ')}</p>` +
        `<div class="pass-body">${skyPlot(v, `pass-${i}`)}${marginChart(v, `pass-${i}`)}</div>` +
        `<ul class="pass-notes">${notes.length > 0 ? notes.join('') : '<li>no warnings on this pass</li>'}</ul></article>`,
    );
  });
  parts.push('</div>');
  return parts.join('\n');
}
