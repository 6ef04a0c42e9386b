/** The report's stylesheet (inlined into the page; no external fonts or files). */
import { ACCENT, ACCENT_SOFT, GOOD, GRID, INK, MUTED, PAPER, RULE, SPACECRAFT_HUES, SURFACE, WARN } from './palette.js';

const SANS = 'system-ui, -apple-system, "Segoe UI", "Noto Sans", "DejaVu Sans", sans-serif';

export function stylesheet(): string {
  const hues = SPACECRAFT_HUES.map((h, i) => `.sc${i}{fill:${h}}.bg-sc${i}{background:${h}}`).join('');
  return `
:root{color-scheme:light}
*{box-sizing:border-box}
body{margin:0;background:${PAPER};color:${INK};font:15px/1.45 ${SANS}}
main{max-width:1240px;margin:0 auto;padding:26px 24px 48px}
header.top{border-bottom:3px solid ${ACCENT};padding-bottom:16px;margin-bottom:8px}
.kicker{font-size:12px;letter-spacing:.12em;text-transform:uppercase;color:${ACCENT};font-weight:650;margin:0}
h1{font-size:26px;font-weight:650;margin:2px 0 2px}
.sub{color:${MUTED};margin:0}
dl.facts{display:grid;grid-template-columns:repeat(6,1fr);gap:10px;margin:16px 0 0}
dl.facts div{background:${SURFACE};border:1px solid ${RULE};border-left:4px solid ${ACCENT};padding:7px 12px}
dl.facts dt{font-size:11px;text-transform:uppercase;letter-spacing:.08em;color:${MUTED}}
dl.facts dd{margin:2px 0 0;font-size:20px;font-weight:600;font-variant-numeric:tabular-nums}
section{background:${SURFACE};border:1px solid ${RULE};border-radius:3px;padding:14px 20px 18px;margin:16px 0}
h2{font-size:17px;margin:0 0 2px;font-weight:650}
h3{font-size:14px;margin:0 0 2px;font-weight:650}
p.note{color:${MUTED};margin:0 0 12px;font-size:13px}
table{border-collapse:collapse;font-variant-numeric:tabular-nums;font-size:13px}
th,td{padding:4px 10px;border-bottom:1px solid ${GRID};text-align:right;white-space:nowrap}
th:first-child,td:first-child,th.text,td.text{text-align:left}
thead th{border-bottom:2px solid ${RULE};color:${MUTED};font-weight:600}
tfoot td{border-top:2px solid ${RULE};font-weight:600}
.swatch{display:inline-block;width:11px;height:11px;border-radius:2px;margin-right:7px;vertical-align:-1px}
svg{display:block;width:100%;height:auto}
svg text{font:11px ${SANS};fill:${MUTED}}
svg text.lbl{fill:${INK};font-weight:600}
svg text.val{fill:${INK};font-size:10px}
svg text.flag,.flag{fill:${WARN};color:${WARN};font-weight:600}
.grid{stroke:${GRID};stroke-width:1}
.axis{stroke:${RULE};stroke-width:1}
.band{fill:${PAPER}}
.day-bar{fill:${ACCENT}}
.day-bar.dst{fill:${ACCENT_SOFT};stroke:${ACCENT};stroke-width:1}
.elev{fill:none;stroke:${INK};stroke-width:1.5}
.contact-bar:hover,.day-bar:hover{stroke:${INK};stroke-width:1}
.panels{display:grid;grid-template-columns:repeat(3,1fr);gap:12px 16px}
.cards{display:grid;grid-template-columns:repeat(2,1fr);gap:14px 18px}
.card,.panel{border-top:1px solid ${GRID};padding-top:8px}
.meta{color:${MUTED};font-size:12px;margin:0 0 4px}
.scroll{overflow-x:auto}
.pass{color:${GOOD};font-weight:600}
.fail{color:${WARN};font-weight:600}
ul.warnings{margin:0;padding-left:18px;font-size:13px}
footer{color:${MUTED};font-size:12px;margin-top:22px}
footer#provenance{background:${SURFACE};border:1px solid ${RULE};padding:14px 20px;color:${INK}}
footer#provenance h2{font-size:15px}footer#provenance h3{margin-top:10px}
dl.prov{display:flex;flex-wrap:wrap;gap:6px 22px;margin:6px 0 8px}dl.prov dt{font-size:11px;color:${MUTED};text-transform:uppercase;letter-spacing:.06em}dl.prov dd{margin:0}
.mono{font-family:ui-monospace,"DejaVu Sans Mono",monospace;font-size:11px}
.attention{margin:14px 0 0;border:1px solid ${WARN};border-left:6px solid ${WARN};background:${SURFACE};padding:8px 14px}
.attention p{margin:0;color:${WARN}}.attention ul{margin:4px 0 0;padding-left:18px;font-size:13px}
tr.alert td{background:#f6e7e2}
table.spacecraft td:last-child{white-space:normal;max-width:260px}
table.contacts td.text{white-space:normal;max-width:230px;font-size:12px}
.sd{font-size:12px}
.sd-row{display:grid;grid-template-columns:170px 92px 1fr 130px;align-items:center;min-height:15px;column-gap:8px}
.sd-row.sd-first{border-top:1px solid ${RULE};margin-top:3px;padding-top:3px}
.sd-axis{color:${MUTED};font-size:11px}
.sd-hours{display:grid;grid-template-columns:repeat(8,1fr)}
.sd-st{white-space:nowrap;overflow:hidden;text-overflow:ellipsis}.sd-day{color:${MUTED};font-variant-numeric:tabular-nums}
.sd-sum{text-align:right;font-variant-numeric:tabular-nums;color:${MUTED}}
svg.sd-track{height:12px;background:${PAPER} repeating-linear-gradient(to right,${RULE} 0 1px,transparent 1px 12.5%)}
.sd-busy{fill:${ACCENT}}
table.contacts tbody.group tr.group-head th{background:${PAPER};text-align:left;color:${INK};font-weight:600;border-top:8px solid ${SURFACE}}
table.contacts tr.groups th{border-bottom:1px solid ${RULE};color:${ACCENT};text-transform:uppercase;font-size:11px;letter-spacing:.08em}
th.geo,td.geo{border-left:2px solid ${RULE}}
table.contacts td:nth-child(n+7){color:${MUTED}}
.passes{display:grid;gap:16px}
.pass-view{border-top:1px solid ${GRID};padding-top:8px}
.pass-body{display:grid;grid-template-columns:250px minmax(0,640px);gap:24px;align-items:start}
svg.sky{max-width:250px}
.sky-rim{fill:${SURFACE};stroke:${RULE}}
.sky-mask{fill:${ACCENT_SOFT};fill-opacity:.45;stroke:${ACCENT};stroke-width:.8}
.sky-track{fill:none;stroke:${INK};stroke-width:1}
.sky-pt{fill:${SURFACE};stroke:${INK};stroke-width:.6}.sky-pt.data{fill:${ACCENT};stroke:${ACCENT}}
.margin-line{fill:none;stroke:${ACCENT};stroke-width:1.6}
.mc0{fill:${ACCENT}}.mc1{fill:${ACCENT_SOFT}}.mc2{fill:#5f8a80}.mc3{fill:#c9d6d2}.mc-none{fill:${WARN};fill-opacity:.5}
svg text.mc-lbl{fill:${SURFACE};font-size:10px;font-weight:600}
ul.pass-notes{margin:6px 0 0;padding-left:18px;font-size:13px}
p.bound{color:${INK};border-left:4px solid ${ACCENT};padding-left:8px}
${hues}
`;
}
