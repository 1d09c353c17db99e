import { PALETTE } from './palette.js';

/**
 * The page's only stylesheet, inlined in `<style>`: system fonts (nothing to download), a narrow
 * reading column for text and wider room for charts, tabular figures in tables, print-friendly.
 */
export function reportStyles(): string {
  return `
:root{--ink:${PALETTE.ink};--muted:${PALETTE.muted};--paper:${PALETTE.paper};--rule:${PALETTE.grid};--accent:${PALETTE.score};--flag:${PALETTE.flag}}
*{box-sizing:border-box}
html{background:var(--paper);color:var(--ink)}
body{margin:0;font:15px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,"Noto Sans","DejaVu Sans",sans-serif}
.page{display:grid;grid-template-columns:210px minmax(0,1fr);gap:32px;max-width:1280px;margin:0 auto;padding:24px}
nav.toc{position:sticky;top:16px;align-self:start;font-size:14px;border-left:3px solid var(--accent);padding-left:12px}
nav.toc ol{list-style:none;margin:8px 0;padding:0}
nav.toc li{margin:4px 0}
nav.toc a{color:var(--ink);text-decoration:none}
nav.toc a:hover{text-decoration:underline}
header.masthead h1{font-size:26px;margin:0 0 4px;letter-spacing:-.01em}
header.masthead .meta{color:var(--muted);font-size:14px}
.banner{border:1px solid var(--flag);background:#fff8ea;padding:10px 14px;margin:16px 0;border-radius:4px}
.report-section{border-top:1px solid var(--rule);padding-top:18px;margin-top:30px}
.report-section h2{font-size:21px;margin:0 0 2px;display:flex;align-items:baseline;gap:10px}
.section-number{display:inline-block;min-width:28px;height:28px;line-height:28px;text-align:center;border-radius:50%;background:var(--ink);color:var(--paper);font-size:15px}
.purpose{color:var(--muted);margin:2px 0 14px;max-width:70ch}
h3{font-size:17px;margin:22px 0 6px}
p{max-width:80ch}
.note{color:var(--muted);font-size:13px}
figure.chart-figure{margin:12px 0 18px;max-width:100%}
figure.chart-figure svg{display:block;max-width:100%;height:auto;background:#fff;border:1px solid var(--rule);border-radius:3px}
figcaption{margin-bottom:6px}
figcaption .chart-title{display:block;font-weight:600}
figcaption .note{display:block}
figure.small{margin:0}
figure.small figcaption{font-size:12px;margin-bottom:2px}
figure.small figcaption .chart-title{font-weight:500}
figure.small svg{border:none}
.multiples{display:grid;grid-template-columns:repeat(auto-fill,minmax(280px,1fr));gap:12px 16px}
.multiples.wide{grid-template-columns:repeat(auto-fill,minmax(480px,1fr))}
.multiples.wide figure{margin:0}
.side-by-side{display:flex;flex-wrap:wrap;gap:16px}
.side-by-side>figure{flex:0 1 442px;min-width:0}
svg text{font-family:inherit;fill:var(--ink)}
svg .tick{font-size:11px}
svg .tick.small{font-size:8px}
svg .axis-title,svg .legend-title{font-size:12px;font-weight:600}
svg .legend{font-size:12px}
svg .stat{font-size:12px;font-weight:600}
svg .term{font-size:12px}
table{border-collapse:collapse;margin:10px 0 18px;font-size:13px;font-variant-numeric:tabular-nums}
caption{text-align:left;font-weight:600;padding-bottom:6px}
th,td{padding:3px 10px;border-bottom:1px solid var(--rule);text-align:left;vertical-align:top}
th{font-weight:600;background:#f1f2f0}
td.num,th.num{text-align:right}
tr.sub th{font-weight:400;padding-left:28px}
tr.group th{background:none;border-bottom:2px solid var(--rule);padding-top:10px;font-size:12px;text-transform:uppercase;letter-spacing:.04em;color:var(--muted)}
tr.total th,tr.total td{font-weight:700}
tr.mismatch td{background:#fde7d9;color:#7a2e00}
tr.not-ready td:last-child{color:#8a5a00;font-weight:600}
.absent{border-left:4px solid var(--rule);padding:6px 12px;background:#fff;color:var(--muted)}
.absent strong{color:var(--ink)}
.warning{border-left:4px solid var(--flag);background:#fff8ea;padding:8px 14px;margin:10px 0}
.warning ul{margin:4px 0;padding-left:20px}
.verdict{border-left:4px solid var(--accent);padding:6px 12px;background:#fff}
.pooled{font-size:14px}
dl.flags{display:grid;grid-template-columns:max-content 1fr;gap:2px 14px;font-size:14px}
dl.flags dt{color:#8a5a00;font-weight:600}
dl.flags dd{margin:0}
ul.never-matched{font-size:14px;padding-left:20px}
ul.never-matched li{margin:2px 0}
table.provenance{max-width:100%}
table.provenance th[scope=row]{font-weight:600;background:none;white-space:nowrap}
table.provenance td{overflow-wrap:anywhere}
code{font-family:ui-monospace,"DejaVu Sans Mono",Menlo,Consolas,monospace;font-size:.92em;overflow-wrap:anywhere}
.muted{color:var(--muted)}
details.results{margin:6px 0;overflow-x:auto}
details.results summary{cursor:pointer;font-weight:600}
ul.cautions li{margin:6px 0;max-width:80ch}
footer{margin-top:40px;color:var(--muted);font-size:13px;border-top:1px solid var(--rule);padding-top:10px}
@media (max-width:900px){.page{grid-template-columns:1fr}nav.toc{position:static}}
@media print{nav.toc{display:none}.page{display:block}.report-section{break-inside:avoid-page}}
`.trim();
}
