/**
 * The page's static HTML (body) and stylesheet. No inline event handlers or style attributes, so the
 * Content-Security-Policy needs nothing beyond the hashes of the one script and the one style block.
 */
import { FIELD_GROUPS, type FieldDef } from './fields.js';

/**
 * The page's one escaper, for text and for every attribute value (markup here and the views app.ts builds):
 * a load id with `"` cannot leave its attribute (before, app.ts had its own that left `"` alone). Every
 * attribute the page writes is double-quoted, so `'` needs no escape (and the CSP's 'none' stays readable).
 */
export const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function control(d: FieldDef): string {
  const id = `f-${d.key}`;
  const common = `id="${id}" name="${d.key}" data-flag="${esc(d.flag)}"`;
  if (d.key === 'loads') return `<textarea ${common} rows="5" spellcheck="false" placeholder="id,Pu,Mu&#10;C1-a,520,180"></textarea>`;
  if (d.kind === 'select') return `<select ${common}>${(d.options ?? []).map(([v, t]) => `<option value="${esc(v)}">${esc(t)}</option>`).join('')}</select>`;
  if (d.kind === 'checkbox') return `<input type="checkbox" ${common}>`;
  const extra = d.kind === 'int' ? ' inputmode="numeric"' : '';
  return `<input type="text" ${common}${extra} autocomplete="off" spellcheck="false"${d.placeholder ? ` placeholder="${esc(d.placeholder)}"` : ''}>`;
}

function fieldRow(d: FieldDef): string {
  const slider = d.key === 'gamma' ? `<input type="range" id="gamma-slider" min="0.3" max="0.95" step="0.005" aria-label="γ slider">` : '';
  return `<div class="row" data-field="${d.key}"><label for="f-${d.key}">${esc(d.label)}</label>${control(d)}${slider}${d.hint ? `<small>${esc(d.hint)}</small>` : ''}<div class="msg" id="m-${d.key}" role="alert" hidden></div></div>`;
}

export function pageBody(caution: string): string {
  const groups = FIELD_GROUPS.map((g) => {
    const rows = g.fields.map(fieldRow).join('');
    const extra =
      g.id === 'family'
        ? `<div class="row"><label for="grid">Between sheets</label><select id="grid"><option value="0.05">γ grid 0.05</option><option value="0.1">γ grid 0.1</option></select><label class="inline"><input type="checkbox" id="show-sheets" checked> show the bracketing sheets</label></div>`
        : g.id === 'loads'
          ? `<div class="row"><button type="button" id="clear-loads">Clear loads</button><button type="button" id="save-loads">Save loads as CSV</button></div><div class="row"><div class="msg" id="url-note" role="status" hidden></div></div>`
          : '';
    const body = `<legend>${esc(g.title)}</legend>${rows}${extra}`;
    return g.folded ? `<details class="group" id="g-${g.id}"><summary>${esc(g.title)}</summary><fieldset>${body}</fieldset></details>` : `<fieldset class="group" id="g-${g.id}">${body}</fieldset>`;
  }).join('');
  return `
<header><h1>pmchart — live column chart</h1><p class="sub">Computed in this page from the same library as the <code>pmchart</code> command line. The page makes no requests; its inputs are kept in its address (after the #), so a reload or a link restores them, and a shared link carries what is in it.</p></header>
<div class="caution" id="caution"><strong>Caution.</strong> ${esc(caution)}</div>
<main>
<form id="inputs" autocomplete="off">${groups}<div class="msg general" id="m-general" role="alert" hidden></div></form>
<section id="out">
  <div class="toolbar"><button type="button" id="export-svg">Export SVG</button><button type="button" id="export-png">Export PNG</button><button type="button" id="print">Print</button><span id="timing" class="muted"></span></div>
  <h2 id="view-title"></h2>
  <div id="chart-wrap" tabindex="0" aria-label="Interaction chart. Arrow keys move a reading point (Shift for larger steps, Home to the middle, Escape to hide); the reading is below the chart." aria-describedby="reading"><div id="chart"></div><div id="crosshair" hidden></div></div>
  <div id="reading" class="reading" aria-live="polite">Move the pointer over the chart, or focus it and use the arrow keys, to read P/Ag, M/(Ag·h), e/h and the interpolated ρg.</div>
  <div id="sheets-note" class="muted"></div>
  <h2>Loads</h2>
  <div id="loads-table"><p class="muted">Type Pu and Mu, or paste a load CSV, with b and h (or D).</p></div>
  <div id="biaxial" hidden>
    <h2>Biaxial: Mx–My contours at the load’s axial levels</h2>
    <div class="toolbar"><label for="biax-load">Levels of load</label> <select id="biax-load"></select> <button type="button" id="export-biaxial-svg">Export SVG</button></div>
    <div id="biaxial-readout" class="reading"></div>
    <div id="biaxial-wrap"><div id="biaxial-chart"></div></div>
    <p id="biaxial-note" class="muted"></p>
    <div id="biaxial-table"></div>
  </div>
  <h2 id="schedule-title">Column schedule</h2>
  <div id="schedule-panel">
    <p class="muted">Paste or drop a schedule (mark, code, units, fc, fy, b, h or diameter, arrangement, bars, cover, tie …) and its loads (mark, id, Pu, Mu …): every mark is checked as <code>pmchart schedule</code> checks it.</p>
    <div class="drops">
      <label for="sched-text">Schedule (CSV)</label><textarea id="sched-text" rows="5" spellcheck="false" placeholder="mark,code,units,fc,fy,b,h,arrangement,bars_per_face,bar,cover,tie&#10;C1,aci318-19,us,5,60,20,20,four-faces,3,#9,1.5,#4"></textarea>
      <label for="sched-loads">Loads (CSV)</label><textarea id="sched-loads" rows="5" spellcheck="false" placeholder="mark,id,Pu,Mu&#10;C1,D+L,600,150"></textarea>
      <label for="sched-columns">Column map</label><input type="text" id="sched-columns" autocomplete="off" spellcheck="false" placeholder="optional, e.g. mark=Column,id=Combo,Pu=P,Mu=M3,Muy=M2">
      <label for="sched-compression">Compression sign</label><select id="sched-compression"><option value="positive">positive (as pmchart)</option><option value="negative">negative (most analysis exports)</option></select>
    </div>
    <div class="msg" id="m-schedule" role="alert" hidden></div>
    <div id="schedule-table"></div>
  </div>
  <h2>Basis and assumptions</h2>
  <ul id="assumptions"></ul>
  <h2 id="reproduce">Reproduce this view</h2>
  <p class="muted">On the command line (with the same inputs):</p>
  <pre id="cmd-sheet" class="copy"></pre>
  <pre id="cmd-check" class="copy"></pre>
  <p class="muted">Chart-set snippet for <code>pmchart set</code> (the bracketing print sheets and the exact γ):</p>
  <pre id="set-json" class="copy"></pre>
  <div class="caution print-only"><strong>Caution.</strong> ${esc(caution)}</div>
</section>
</main>`;
}

export const PAGE_CSS = `
:root{--ink:#1f2a33;--muted:#5f6b76;--rule:#c9d1d8;--panel:#f3f5f7;--accent:#2c7a7b;--caution:#9b2c2c;--paper:#fff}
*{box-sizing:border-box}
body{margin:0;font-family:"DejaVu Sans",Verdana,sans-serif;color:var(--ink);background:var(--paper);font-size:13px;line-height:1.4}
header{padding:10px 16px 4px;border-bottom:3px solid var(--accent)}
h1{font-size:18px;margin:0}
h2{font-size:14px;margin:16px 0 6px;border-bottom:1px solid var(--rule)}
.sub,.muted{color:var(--muted)}
.sub{margin:2px 0 6px}
.caution{margin:8px 16px;padding:6px 10px;border:1px solid var(--caution);background:#fbf1ef;color:var(--caution)}
main{display:grid;grid-template-columns:310px minmax(0,1fr);gap:14px;padding:0 16px 24px}
form .group{border:1px solid var(--rule);background:var(--panel);margin:0 0 8px;padding:4px 8px 6px}
details.group>fieldset{border:0;padding:0;margin:0}
details.group>fieldset>legend{display:none}
legend,summary{font-weight:bold;color:var(--accent)}
.row{display:grid;grid-template-columns:96px 1fr;gap:2px 6px;align-items:center;margin:3px 0}
.row small,.row .msg,.row .inline,#gamma-slider{grid-column:2}
.row small{color:var(--muted);font-size:11px}
input[type=text],select,textarea{width:100%;font:inherit;padding:2px 4px;border:1px solid var(--rule);background:#fff}
textarea{font-family:"DejaVu Sans Mono",monospace;font-size:12px}
.invalid input,.invalid select,.invalid textarea{border-color:var(--caution);outline:1px solid var(--caution)}
.msg{color:var(--caution);font-size:12px}
.msg.general{margin-top:6px}
button{font:inherit;padding:3px 10px;margin-right:6px;border:1px solid var(--accent);background:#fff;color:var(--accent);cursor:pointer}
.toolbar{margin:8px 0}
#chart-wrap{position:relative;border:1px solid var(--rule)}
#chart-wrap:focus-visible{outline:2px solid var(--accent);outline-offset:2px}
#chart svg,#chart canvas{width:100%;height:auto;display:block}
#biaxial-wrap{border:1px solid var(--rule);overflow-x:auto}
#biaxial-chart svg{max-width:100%;height:auto;display:block}
#biaxial-readout table td,#biaxial-readout table th{border:0;padding:1px 10px 1px 0;text-align:left}
#biaxial-table td.rho{text-align:left;font-weight:bold}
.biaxial-caution{color:var(--caution);font-size:12px}
select#biax-load{width:auto;min-width:10em}
#crosshair{position:absolute;width:9px;height:9px;margin:-5px 0 0 -5px;border:1px solid var(--caution);border-radius:50%;pointer-events:none}
.reading{margin:6px 0;padding:4px 8px;background:var(--panel);font-variant-numeric:tabular-nums;min-height:1.6em}
#loads-table,#schedule-table{overflow-x:auto}
.drops{display:grid;grid-template-columns:120px minmax(0,1fr);gap:4px 8px;align-items:start;max-width:760px}
.drops textarea.over{outline:2px dashed var(--accent)}
th.left,td.left{text-align:left}
th.right,td.right{text-align:right}
table{border-collapse:collapse;font-variant-numeric:tabular-nums}
th,td{border-bottom:1px solid var(--rule);padding:2px 8px;text-align:right;white-space:nowrap}
th:first-child,td:first-child,td.status{text-align:left}
tr.governing td{font-weight:bold;color:var(--caution)}
pre.effects{background:#fbf1ef;padding:6px 8px;white-space:pre-wrap;font-size:12px}
pre.copy{background:var(--panel);padding:6px 8px;white-space:pre-wrap;word-break:break-all;user-select:all;font-size:12px}
.print-only{display:none}
@media print{
  @page{size:landscape;margin:10mm}
  header .sub,form,.toolbar,#reading,#crosshair,#reproduce,#cmd-sheet,#cmd-check,#set-json,#out>p.muted{display:none}
  main{display:block;padding:0}
  #chart-wrap,#biaxial-wrap{border:0;page-break-inside:avoid}
  #biaxial .toolbar{display:none}
  #chart svg{width:auto;max-width:100%;max-height:150mm}
  table,#assumptions{page-break-inside:avoid}
  .print-only{display:block}
  body{font-size:10px}
}
`;
