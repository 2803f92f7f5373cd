/** The preview page's style sheet: system fonts only, a controls column, the plan view and the report panel. */
export const PAGE_STYLE = `
:root{--ink:#1d232b;--muted:#5a6470;--rule:#d6dbe1;--pass:#17692c;--warn:#8a5a00;--fail:#a11b1b;--ol:#0b5cc0}
*{box-sizing:border-box}
html,body{height:100%}
body{margin:0;font:14px/1.4 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:var(--ink);display:grid;
  grid-template-columns:270px 1fr;grid-template-rows:auto 1fr;grid-template-areas:"top top" "controls main"}
header.top{grid-area:top;display:flex;align-items:baseline;gap:.8rem;padding:.45rem .9rem;border-bottom:1px solid var(--rule);background:#fafbfc}
header.top h1{font-size:1.05rem;margin:0;white-space:nowrap}
header.top .file{font-family:ui-monospace,Menlo,Consolas,monospace;color:var(--muted);word-break:break-all}
.status{margin-left:auto;font-size:.85rem;padding:.1rem .55rem;border-radius:3px;background:#eef1f4;white-space:nowrap;overflow:hidden;text-overflow:ellipsis;max-width:60%}
.status.pass{background:#e3f3e7;color:var(--pass)}.status.warn{background:#fff1d6;color:var(--warn)}.status.fail{background:#fbe4e4;color:var(--fail)}
.status.busy::before{content:"";display:inline-block;width:.7em;height:.7em;margin-right:.4em;border:2px solid currentColor;border-right-color:transparent;border-radius:50%;animation:spin .8s linear infinite;vertical-align:-.05em}
@keyframes spin{to{transform:rotate(360deg)}}
aside#controls{grid-area:controls;overflow:auto;padding:.4rem .7rem 1rem;border-right:1px solid var(--rule);background:#fafbfc}
fieldset{border:0;border-top:1px solid var(--rule);margin:.5rem 0 0;padding:.3rem 0 0}
legend{font-weight:650;font-size:.8rem;text-transform:uppercase;letter-spacing:.05em;color:var(--muted);padding-right:.4rem}
.ctl{margin:.35rem 0}
.ctl label{display:block;font-size:.86rem}
.ctl-check{display:flex;flex-wrap:wrap;align-items:center;gap:.35rem}.ctl-check label{display:inline}
.ctl .line{display:flex;align-items:center;gap:.35rem}
.ctl input[type=text]{width:100%;font:inherit;padding:.15rem .35rem;border:1px solid #b9c1ca;border-radius:3px}
.ctl input[type=range]{width:100%;margin:.15rem 0 0}
.ctl select{font:inherit;width:100%;padding:.1rem}
.ctl .unit{font-size:.8rem;color:var(--muted);min-width:2.2em}
.ctl input[aria-invalid=true]{border-color:var(--fail);background:#fff5f5}
.err{color:var(--fail);font-size:.8rem;overflow-wrap:anywhere}.err:empty{display:none}
main{grid-area:main;overflow:auto;display:flex;flex-direction:column;min-width:0}
.toolbar{flex:0 0 auto;display:flex;align-items:center;gap:.6rem;padding:.3rem .7rem;border-bottom:1px solid var(--rule);flex-wrap:wrap}
.layers{display:flex;flex-wrap:wrap;align-items:center;gap:.15rem .3rem;font-size:.85rem}.layers label{margin-right:.5rem}
button{font:inherit;font-size:.85rem;padding:.15rem .6rem;border:1px solid #b9c1ca;border-radius:3px;background:#fff;cursor:pointer}
button:hover{background:#eef3fb}
.sw{display:inline-block;width:.8em;height:.8em;border-radius:2px;margin-right:.15rem;vertical-align:-.05em}
.sw-density{background:linear-gradient(90deg,#fff,#373737);border:1px solid #b9c1ca}.sw-thickness{background:linear-gradient(90deg,#440154,#21918c,#fde725)}
.sw-outline{background:rgba(11,92,192,.25);border:1.5px solid #0b5cc0}.sw-repair{background:rgba(20,150,60,.55)}
.sw-passive{border:1.5px solid #6a2c91}.sw-findings{border:2px solid #d01c1c;border-radius:50%}
.legend{flex:0 0 auto;font-size:.78rem;color:var(--muted);padding:.15rem .7rem;min-height:1.3em}
.stage{position:relative;flex:0 0 auto;height:52vh;min-height:260px;overflow:hidden}
canvas#view{position:relative;display:block;width:100%;height:100%;cursor:grab;touch-action:none}
.plane{position:absolute;left:0;top:0;pointer-events:none}
canvas.plane{width:100%;height:100%}
svg.stress{overflow:visible}
svg.stress .domain{fill:none;stroke:none}
svg.stress .raster{image-rendering:pixelated}
.sw-stress{background:linear-gradient(90deg,#2c3e9e,#8cd14f,#fdc02f,#c61a1a)}
.stress-info{flex:0 0 auto;padding:.2rem .7rem .3rem;border-bottom:1px solid var(--rule);font-size:.8rem;color:var(--muted)}
.stress-info svg.legend{display:block;width:100%;max-width:680px;height:auto;font-size:12px}
.stress-info .legend .axis{stroke:var(--ink);fill:none}.stress-info .legend .tick{fill:var(--muted)}
.stress-info .legend .label,.stress-info .legend .note{fill:var(--ink)}.stress-info .legend .frame{fill:none;stroke:#6b7480}
.stress-info .legend .limit{stroke:var(--ink);stroke-width:2}
.stress-info .caption{margin:.2rem 0 0;max-width:80rem}
canvas#view.dragging{cursor:grabbing}
.progress{position:absolute;left:0;right:0;top:0;height:4px;overflow:hidden;background:rgba(11,92,192,.15);z-index:1}
.progress .bar{height:100%;width:0;background:var(--ol);transition:width .15s linear}
.readout{flex:0 0 auto;font:12px ui-monospace,Menlo,Consolas,monospace;color:var(--muted);padding:.2rem .7rem;border-top:1px solid var(--rule);border-bottom:1px solid var(--rule);white-space:nowrap;overflow:hidden;text-overflow:ellipsis}
.side{padding:.5rem .9rem 1.5rem}
.cmd,.downloads{display:flex;align-items:center;gap:.5rem;margin:.3rem 0;flex-wrap:wrap}
.k{font-size:.8rem;color:var(--muted)}
.cmd code{flex:1 1 20rem;font:12px ui-monospace,Menlo,Consolas,monospace;background:#f2f4f6;padding:.3rem .5rem;border-radius:3px;overflow-wrap:anywhere}
`;
