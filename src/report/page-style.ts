/** The style sheet of the HTML report: system fonts only (no web fonts), readable on screen and in print. */
export const PAGE_CSS = `
:root{--ink:#1d232b;--muted:#5a6470;--rule:#d6dbe1;--pass:#17692c;--warn:#8a5a00;--fail:#a11b1b;--mk-fail:#d01c1c;--mk-warn:#e89a00;--ol:#0b5cc0}
*{box-sizing:border-box}
body{font:15px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;margin:1.5rem auto;max-width:1120px;padding:0 1rem;color:var(--ink)}
h1{font-size:1.35rem;margin:.2rem 0 .4rem}h1 .file{font-family:ui-monospace,Menlo,Consolas,monospace;font-weight:500;color:var(--muted);word-break:break-all}
h2{font-size:1.05rem;margin:1.6rem 0 .5rem;border-bottom:1px solid var(--rule);padding-bottom:.15rem}
.result{font-size:1.05rem;margin:.3rem 0 .8rem}
.badge{display:inline-block;font-weight:700;font-size:.8em;letter-spacing:.04em;padding:.05rem .45rem;border-radius:3px;color:#fff;vertical-align:.08em}
.badge.pass{background:var(--pass)}.badge.warn{background:#b87800}.badge.fail{background:var(--fail)}.badge.none{background:#6b7480}
.keys{display:grid;grid-template-columns:repeat(auto-fill,minmax(150px,1fr));gap:.4rem .8rem;margin:0}
.keys div{border-left:3px solid var(--rule);padding:.1rem .5rem}.keys dt{font-size:.78rem;color:var(--muted)}.keys dd{margin:0;font-weight:600;font-variant-numeric:tabular-nums}
.cautions{background:#fff6e5;border-left:4px solid #d08c00;padding:.3rem 1rem .4rem;margin:1rem 0}
.cautions h2{border:0;margin:.3rem 0;font-size:.95rem}.cautions ul{margin:.2rem 0;padding-left:1.2rem}.cautions li{margin:.15rem 0}
figure{margin:1.2rem 0;break-inside:avoid;page-break-inside:avoid}
figcaption{font-size:.88rem;color:var(--muted);margin-top:.3rem}
svg.plan{display:block;width:100%;height:auto;max-height:78vh;background:#fff;border:1px solid var(--rule)}
svg.defs{position:absolute;width:0;height:0;overflow:hidden}
svg.chart{display:block;width:100%;max-width:640px;height:auto;font-size:12px}
svg.legend{display:block;width:100%;max-width:680px;height:auto;font-size:12px;margin-top:.3rem}
figure img{max-width:100%;border:1px solid var(--rule)}
.raster{image-rendering:pixelated}
.domain{fill:none;stroke:#9aa3ad;stroke-width:1;vector-effect:non-scaling-stroke;stroke-dasharray:4 3}
.ol-density .outline,.ol-density use{fill:rgba(11,92,192,.10);stroke:var(--ol);stroke-width:1.4;vector-effect:non-scaling-stroke}
.rp-after use{fill:rgba(11,92,192,.10);stroke:var(--ol);stroke-width:1.4;vector-effect:non-scaling-stroke}
.rp-changed .outline{fill:rgba(20,150,60,.55);stroke:#13823a;stroke-width:1;vector-effect:non-scaling-stroke}
.rp-before .outline{fill:none;stroke:#555;stroke-width:1.1;stroke-dasharray:4 3;vector-effect:non-scaling-stroke}
.rp-site rect{fill:#13823a;stroke:#fff;stroke-width:.6;vector-effect:non-scaling-stroke}
.rp-site text{fill:#0b5a27;font-weight:600}
.ol-thick use{fill:none;stroke:#1d232b;stroke-width:1.1;vector-effect:non-scaling-stroke}
.mk circle{fill:none;stroke-width:2.2;vector-effect:non-scaling-stroke}
.mk.fail circle{stroke:var(--mk-fail)}.mk.warn circle{stroke:var(--mk-warn)}
.mk text{font-weight:700;paint-order:stroke;stroke:#fff;stroke-width:3;vector-effect:non-scaling-stroke;stroke-linejoin:round}
.mk.fail text{fill:var(--mk-fail)}.mk.warn text{fill:#a86a00}
.scalebar path{fill:none;stroke:var(--ink);stroke-width:1.5;vector-effect:non-scaling-stroke}.scalebar text{fill:var(--ink)}
.chart .grid{stroke:#e6e9ed}.chart .axis,.legend .axis{stroke:var(--ink);fill:none}.chart .tick,.legend .tick{fill:var(--muted)}
.chart .label,.legend .label{fill:var(--ink)}.chart .curve{fill:none;stroke:var(--ol);stroke-width:2}
.chart .target{stroke:#6b7480;stroke-dasharray:5 4}.chart .level{stroke:var(--fail);stroke-dasharray:5 4}
.chart .cells{fill:var(--ol)}.chart .achieved{fill:var(--fail)}.chart .note,.legend .note{fill:var(--ink)}
.legend .frame{fill:none;stroke:#6b7480}.legend .limit{stroke:var(--ink);stroke-width:2}
table{border-collapse:collapse;margin:.4rem 0;font-size:.92rem}
th,td{text-align:left;padding:.22rem .7rem .22rem 0;vertical-align:top}th{font-weight:600;color:var(--muted)}
table.grid th,table.grid td{border-bottom:1px solid #eceff2;padding-left:.4rem}table.grid thead th{border-bottom:1px solid var(--rule)}
td.n{font-variant-numeric:tabular-nums;white-space:nowrap}td.id{font-family:ui-monospace,Menlo,Consolas,monospace;white-space:nowrap}
tr.fail td.id{color:var(--fail)}tr.warn td.id{color:var(--warn)}
table.findings tr:target{background:#fff3c4}
table.kv td{overflow-wrap:anywhere}
.cols{display:grid;grid-template-columns:repeat(auto-fit,minmax(320px,1fr));gap:0 2rem}
.more{font-size:.9rem;color:var(--muted)}
footer{margin:2rem 0 1rem;font-size:.8rem;color:var(--muted);border-top:1px solid var(--rule);padding-top:.4rem}
@media print{body{margin:0;max-width:none;font-size:11pt}svg.plan{max-height:none}.cautions{border-left-color:#000}a{color:inherit;text-decoration:none}h2{break-after:avoid}}
`;
