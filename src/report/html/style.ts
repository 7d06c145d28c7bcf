/** Inline stylesheet: neutral, print-friendly; status colours are tints after the Okabe-Ito palette. */
const STATUS_CSS = [
  ['ok', '#dff2ea', '#00684b'],
  ['diverged', '#fbe4d3', '#9c4300'],
  ['failed', '#f4e0ec', '#7d3560'],
  ['not-settled', '#fcefd2', '#7a5400'],
  ['outside-limits', '#f9d9d6', '#8f1d12'],
  ['predicted', '#eeeeee', '#444444'],
  ['unreachable', '#dcecf7', '#0b4f7a'],
  ['unknown', '#ffffff', '#000000'],
].map(([s, bg, fg]) => `.st-${s}{background:${bg};color:${fg}}`).join('\n');

const HIDE_CSS = ['ok', 'diverged', 'outside-limits', 'failed', 'not-settled', 'predicted', 'unreachable']
  .map((s) => `table.hide-${s} tr[data-status="${s}"]`).join(',') + '{display:none}';

export const CSS = `
:root{--ink:#1b1b1b;--muted:#5a5a5a;--line:#c9c9c9;--soft:#f4f4f4;font-family:system-ui,-apple-system,"Segoe UI",Roboto,"Helvetica Neue",Arial,sans-serif}
body{margin:0 auto;max-width:1500px;padding:0 20px 40px;color:var(--ink);background:#fff;font-size:14px;line-height:1.45}
h1{font-size:22px;margin:18px 0 2px}h2{font-size:18px;margin:28px 0 8px;padding-top:6px;border-top:2px solid var(--ink)}
h3{font-size:15px;margin:14px 0 6px}
nav{font-size:13px;color:var(--muted)}nav a{margin-right:14px}
a{color:#0b4f7a}
code{font-size:12px}
.caption{color:var(--muted);max-width:1100px;margin:4px 0 10px}
.notice{background:var(--soft);border-left:4px solid var(--muted);padding:6px 10px;color:var(--ink)}
.banner{background:#fcefd2;border:2px solid #7a5400;padding:8px 12px}
.facts{display:grid;grid-template-columns:max-content 1fr;gap:2px 14px;margin:6px 0}
.facts dt{color:var(--muted)}.facts dd{margin:0}
.counts{display:flex;flex-wrap:wrap;gap:8px;list-style:none;padding:0;margin:10px 0}
.counts li{border:1px solid var(--line);padding:4px 10px;border-radius:4px}
.counts li.none{opacity:.55}
.counts .big{font-size:18px;font-weight:600;margin-right:2px}
table{border-collapse:collapse;font-variant-numeric:tabular-nums}
table.worst{margin:8px 0}table.worst caption{text-align:left;font-weight:600;padding-bottom:4px}
table.worst td,table.worst th{border-bottom:1px solid var(--line);padding:2px 10px 2px 0;text-align:left}
td.num{text-align:right}
.panels{display:flex;flex-wrap:wrap;gap:6px 14px}
.panels svg{width:420px;max-width:100%;height:auto}
svg.plot{font-size:10px;background:#fff}
svg.plot text{fill:var(--ink)}
svg.plot .title{font-size:12px;font-weight:600}
svg.plot .axis{font-size:10.5px;fill:var(--muted)}
svg.plot .grid{stroke:#e4e4e4;stroke-width:1;fill:none}
svg.plot .border{fill:none;stroke:#8a8a8a}
svg.plot .curve,svg.plot .series,svg.plot .lgsw{fill:none;stroke-width:1.6;stroke-linejoin:round}
svg.plot .band{opacity:.16;stroke:none}
svg.plot .capacitive{fill:#ececec;stroke:none}
svg.plot .region{font-size:10px;fill:#6b6b6b}
svg.plot .boundary{fill:none;stroke:#555;stroke-width:1.2;stroke-dasharray:5 3}
.legend svg .boundary{stroke:#555;stroke-dasharray:5 3}
svg.plot .marker{stroke:#777;stroke-width:1;fill:#555;font-size:10px}
svg.plot text.marker{stroke:none}
svg.plot .target{stroke:#777;stroke-dasharray:1 3;stroke-width:1.2}
svg.plot .curve-label{font-size:10.5px;font-weight:600;paint-order:stroke;stroke:#fff;stroke-width:3px}
svg.plot .gap{stroke:#333;stroke-width:1}
svg.plot .fwindow{fill:#009E73;opacity:.08;stroke:none}svg.plot .fedge{stroke:#009E73;stroke-width:1.2;stroke-dasharray:5 3}svg.plot text.fedge{fill:#00684b;stroke:none;font-size:10px}
svg.plot .bound{stroke:#8f1d12;stroke-width:1.5}svg.plot .rating{stroke:#8f1d12;stroke-width:1;stroke-dasharray:5 3}
svg.plot text.bound,svg.plot text.rating{fill:#8f1d12;stroke:none;font-size:10px}
svg.plot .bar{fill:#0072B2;fill-opacity:.7}svg.plot .confirmed{fill:#000}svg.plot text.bound-label{fill:#8f1d12;font-size:10px}
.hists{display:flex;flex-wrap:wrap;gap:8px}.hists figure{margin:0;max-width:440px}.sens{display:flex;gap:6px;align-items:center;font-size:12px}.sens-name{width:6em}.sens-bar{display:inline-block;height:10px;background:#0072B2}svg.plot text.row{font-size:10px}
svg.plot .pt-ideal{stroke:#E69F00;stroke-width:2}svg.plot.stress .pt-sim{fill:#0072B2}svg.plot .pt-sim.out{stroke:#D55E00;stroke-width:2}svg.plot.stress .pt-fha{stroke:#333}
.missed{border:2px solid #8f1d12;background:#fbeceb;padding:6px 12px;margin:10px 0}.missed h3{margin:4px 0}.missed-none{color:#00684b}
.map .lim{display:block;font-size:12px}.legend .fwindow{fill:#009E73;opacity:.25}
svg.plot .pt-fha,.legend .pt-fha{fill:#fff;stroke-width:1.8}
svg.plot .pt-sim{stroke:#222;stroke-width:.8}
svg.plot .pt-ideal{fill:none}
svg.plot .pt-meas,.legend .sw path.pt-meas{stroke:#111;stroke-width:1.1;stroke-linejoin:round}
svg.plot a.op:hover .pt-fha,svg.plot a.op:hover .pt-sim,svg.plot a.op:hover .pt-meas{stroke-width:3}
svg.plot .edge{stroke:#bbb;stroke-width:1;stroke-dasharray:2 3}
svg.plot .zero{stroke:#999;stroke-width:.8}
svg.plot .gate{fill:#222}
svg.plot .ptitle{font-size:11px;font-weight:600}
.legend{display:flex;flex-wrap:wrap;gap:4px 18px;font-size:12.5px;margin:8px 0}
.legend span{white-space:nowrap}.legend .sw{width:28px;height:12px;vertical-align:middle;margin-right:4px}
.legend .sw path{fill-opacity:1;stroke-width:1.8;fill:none}.legend .sw path[fill]{fill:#333}
.key span{padding:1px 8px;border-radius:3px;border:1px solid var(--line)}
.maps{display:flex;flex-wrap:wrap;gap:10px 24px}
figure{margin:0}
figure.map figcaption{font-size:12.5px;font-weight:600;margin:6px 0 4px}
table.map th,table.map td{border:1px solid var(--line);padding:0;font-size:12px;vertical-align:top}
table.map th{padding:4px 8px;background:var(--soft);font-weight:600}
table.map td a{display:block;padding:3px 7px;color:inherit;text-decoration:none;min-width:110px}
table.map td a+a{border-top:1px dashed var(--line)}
table.map td a:hover{text-decoration:underline}
table.map .v{display:block;font-weight:600}table.map .sw{display:block;font-size:11.5px}
td.empty{color:var(--muted);text-align:center}
.filter{border:1px solid var(--line);display:flex;flex-wrap:wrap;gap:6px 10px;align-items:center;margin:0 0 8px;padding:4px 10px 8px}
.filter label{padding:1px 8px;border-radius:3px;cursor:pointer}
.filter output{margin-left:auto;color:var(--muted)}
.tablewrap{overflow-x:auto;border:1px solid var(--line)}
table.cmp{font-size:12px;white-space:nowrap}
table.cmp th,table.cmp td{padding:2px 5px;border-bottom:1px solid #e2e2e2;text-align:right}
table.cmp thead th{background:var(--soft);border-bottom:1px solid var(--line);text-align:center;vertical-align:bottom}
table.cmp tbody th{text-align:left;font-weight:600;position:sticky;left:0;background:#fff;z-index:1;border-right:1px solid var(--line)}
table.cmp .grp{border-left:1px solid var(--line)}
table.cmp td.st{text-align:left}
table.cmp td.pair{text-align:center}
table.cmp thead tr:first-child th:first-child{position:sticky;left:0;z-index:2}
table.cmp button{all:unset;cursor:pointer;padding:0 2px}
table.cmp button:hover,table.cmp button:focus-visible{text-decoration:underline;outline:1px dotted}
table.cmp th[aria-sort=ascending] button::after{content:" ▴"}
table.cmp th[aria-sort=descending] button::after{content:" ▾"}
table.cmp td.info{color:var(--muted)}
table.cmp td.flag{font-weight:700;background:#fbe4d3;color:#7a3400;box-shadow:inset 0 0 0 1px #c56a2a}
.mark{margin-left:2px;font-size:10px}
table.cmp td.notes{text-align:left;white-space:normal;min-width:120px;max-width:520px}
table.cmp td.notes button.more{color:#0b4f7a;text-decoration:underline dotted}
table.cmp td.notes button.more::before{content:"▸ "}
table.cmp td.notes.open button.more::before{content:"▾ "}
table.cmp td.notes ul{display:none;margin:4px 0;padding-left:16px;font-size:11.5px;width:480px}
table.cmp td.notes.open ul{display:block}
table.cmp td.notes pre{white-space:pre-wrap;font-size:10.5px}
table.bench td.metric,table.bench td.notes{text-align:left}table.bench td.meas{font-weight:600}table.bench tbody th small{font-weight:400;color:var(--muted)}
table.cmp tr:target th,table.cmp tr:target td{outline:2px solid #0072B2;outline-offset:-2px}
a.wl{text-decoration:none;font-weight:400}
.waves{display:grid;grid-template-columns:repeat(auto-fill,minmax(560px,1fr));gap:16px 24px}
figure.wave{border:1px solid var(--line);padding:6px 8px}
figure.wave figcaption{font-size:12.5px;margin-bottom:2px}
figure.wave:target{outline:2px solid #0072B2}
.wave svg{width:100%;height:auto}
details.more>summary{cursor:pointer;margin:12px 0;font-weight:600}
.caution{border:2px solid var(--ink);padding:8px 12px;max-width:1100px}
.refs{font-size:13px;max-width:1100px}
footer{margin-top:30px;color:var(--muted);font-size:12px}
${STATUS_CSS}
${HIDE_CSS}
@media print{
  body{max-width:none;padding:0;font-size:10pt}nav,.filter{display:none}
  h2{break-after:avoid}svg.plot,figure,table.map{break-inside:avoid}
  .tablewrap{overflow:visible;border:none}table.cmp{font-size:6.5pt}table.cmp td.notes ul{display:none}
  table.cmp td.notes button.more::before{content:none}.waves{grid-template-columns:repeat(2,1fr)}
  a{color:inherit;text-decoration:none}
}
`;
