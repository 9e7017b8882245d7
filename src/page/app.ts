/// <reference lib="dom" />
/**
 * The live page in the browser: reads the form, asks engine.ts for every figure, draws the chart with
 * vega-lite (the sheet template of src/chart/) and formats tables. Computes nothing itself.
 */
import * as vega from 'vega';
import { compile } from 'vega-lite';
import { expressionInterpreter } from 'vega-interpreter';
import { liveData, liveTemplateParams, pageChartData, pageChartTemplate, type PageChartData, type PageLoad } from '../chart/page-spec.js';
import { chartSetSnippet, commandLine } from './commands.js';
import { esc } from './markup.js';
import { biaxialRows, biaxialTemplate, type BiaxialRow, type BiaxialWords } from './biaxial-spec.js';
import { biaxialView, chartView, checkFlags, loadsView, PAGE_CAUTION, readingAt, scheduleView, type BiaxialView, type ChartView, type CheckJson, type PageFields, type PageLoads, type ScheduleView } from './engine.js';
import { SCHEDULE_TABLE } from '../report/schedule-view.js';
import { tableCells } from '../report/view-table.js';
import type { ColumnCheck } from '../design/column-check.js';
import { ALL_FIELDS, FIELD_DEFAULTS, fieldForPath } from './fields.js';
import { decodeState, encodeState, loadsCsv } from './state.js';
import { DISPLAY_UNITS, type UnitSystem } from '../units/index.js';

interface Presets {
  fields: Record<string, string | boolean>;
  grid?: number;
  date: string;
}

const $ = <T extends HTMLElement = HTMLElement>(id: string): T => document.getElementById(id) as T;
const presets = JSON.parse($('pmchart-presets').textContent ?? '{}') as Presets;

// ── form ────────────────────────────────────────────────────────────────────────────────────────

const control = (key: string) => $<HTMLInputElement & HTMLSelectElement & HTMLTextAreaElement>(`f-${key}`);

/** The state a link or a reload carries in the URL fragment (over the presets), if any. */
const restored = decodeState(location.hash, new Set(ALL_FIELDS.map((d) => d.key)), new Set(ALL_FIELDS.filter((d) => d.kind === 'checkbox').map((d) => d.key)));

function fillForm(): void {
  const values = { ...FIELD_DEFAULTS, ...presets.fields, ...restored?.values };
  for (const d of ALL_FIELDS) {
    const v = values[d.key];
    const el = control(d.key);
    if (d.kind === 'checkbox') el.checked = v === true;
    else el.value = v === undefined || v === true || v === false ? '' : String(v);
  }
  $<HTMLInputElement>('gamma-slider').value = control('gamma').value;
  const g = restored?.grid ?? presets.grid;
  if (g) $<HTMLSelectElement>('grid').value = String(g);
}

/** The form's raw values by field key, for the URL fragment. */
function formValues(): Record<string, string | boolean> {
  return Object.fromEntries(ALL_FIELDS.map((d) => [d.key, d.kind === 'checkbox' ? control(d.key).checked : control(d.key).value]));
}

/** Writes the inputs into the URL fragment (no history entry), leaving out pasted loads beyond the cap and saying so. */
function saveState(): void {
  const { fragment, loadsLeftOut } = encodeState({ values: formValues(), grid: grid() });
  try {
    history.replaceState(null, '', `#${fragment}`);
  } catch {
    // some browsers refuse history changes on file:// pages; the page works on without
  }
  const note = $('url-note');
  note.hidden = !loadsLeftOut;
  note.textContent = loadsLeftOut ? 'The pasted loads are too long for the page’s address: a reload or a shared link keeps the other inputs but not them. Save them as CSV to keep them.' : '';
}

/** The form as CLI options: empty fields are left out, so the CLI's defaults apply. */
function readFields(): PageFields {
  const o: Record<string, string | boolean | undefined> = {};
  for (const d of ALL_FIELDS) {
    if (['ratioKind', 'ratios', 'loads', 'pu', 'mu', 'muy'].includes(d.key)) continue;
    const el = control(d.key);
    if (d.kind === 'checkbox') o[d.key] = el.checked || undefined;
    else if (el.value.trim() !== '') o[d.key] = el.value.trim();
  }
  const ratios = control('ratios').value.trim();
  if (ratios !== '') o[control('ratioKind').value === 'omega' ? 'omega' : 'rho'] = ratios;
  return o as PageFields;
}

function readLoads(): PageLoads | null {
  const text = control('loads').value;
  if (text.trim() !== '') return { kind: 'csv', text };
  const pu = control('pu').value.trim();
  const mu = control('mu').value.trim();
  const muy = control('muy').value.trim();
  if (pu === '' && mu === '' && muy === '') return null;
  return { kind: 'typed', pu, mu, ...(muy ? { muy } : {}) } as PageLoads;
}

const grid = (): number => Number($<HTMLSelectElement>('grid').value);

function clearMessages(scope: 'chart' | 'loads'): void {
  const loadKeys = new Set(['pu', 'mu', 'muy', 'loads', 'b', 'h', 'diameter']);
  for (const d of ALL_FIELDS) {
    if ((scope === 'loads') !== loadKeys.has(d.key)) continue;
    const m = $(`m-${d.key}`);
    m.hidden = true;
    m.textContent = '';
    m.parentElement!.classList.remove('invalid');
  }
  if (scope === 'chart') {
    $('m-general').hidden = true;
  }
}

function showProblem(path: string, message: string): void {
  const key = fieldForPath(path);
  const m = key ? $(`m-${key}`) : $('m-general');
  m.textContent = message;
  m.hidden = false;
  m.parentElement!.classList.add('invalid');
  const details = m.closest('details');
  if (details) details.open = true;
}

// ── chart ───────────────────────────────────────────────────────────────────────────────────────

let view: vega.View | null = null;
let templateKey = '';
let current: ChartView | null = null;
let currentCheck: CheckJson | null = null;
let datasetNames: string[] = [];

let currentData: PageChartData | null = null;
let compiles = 0;

const compileView = (template: Record<string, unknown>, data: PageChartData) => vega.parse(compile({ ...template, datasets: data } as never).spec, undefined, { ast: true });

async function draw(cv: ChartView, check: CheckJson | null): Promise<void> {
  const loads: PageLoad[] = (check?.results ?? []).map((r) => {
    const n = r.normalised as { P: number | null; M: number | null };
    return { id: String(r.id), M: (n.M ?? NaN) / cv.divisor, P: (n.P ?? NaN) / cv.divisor, governing: r.governing === true };
  });
  const showSheets = $<HTMLInputElement>('show-sheets').checked;
  const template = pageChartTemplate(liveTemplateParams(cv.built.template));
  currentData = pageChartData({ set: cv.set, built: cv.built, sheets: showSheets ? cv.sheets : [], divisor: cv.divisor, loads, sheetsCaption: sheetsText(cv) });
  const data = liveData(currentData);
  const key = JSON.stringify(template);
  if (!view || key !== templateKey) {
    // compile once per template; later changes only swap the datasets
    const vgSpec = compile({ ...template, datasets: data } as never).spec;
    view?.finalize();
    view = new vega.View(vega.parse(vgSpec, undefined, { ast: true }), { expr: expressionInterpreter as never, renderer: 'svg', container: '#chart', hover: false });
    templateKey = key;
    compiles++;
    const declared = new Set(((vgSpec.data ?? []) as { name: string }[]).map((d) => d.name));
    datasetNames = Object.keys(data).filter((name) => declared.has(name));
    await view.runAsync();
    fitToWidth(template);
    return;
  }
  for (const name of datasetNames) view.data(name, (data as unknown as Record<string, unknown[]>)[name] ?? []);
  await view.runAsync();
}

/** A viewBox lets the drawing scale with the page's width (vega gives the SVG a fixed size). */
function fitToWidth(template: Record<string, unknown>): void {
  const svg = $('chart').querySelector('svg');
  const pad = template.padding as { left: number; right: number; top: number; bottom: number };
  const w = (template.width as number) + pad.left + pad.right;
  const h = (template.height as number) + pad.top + pad.bottom;
  svg?.setAttribute('viewBox', `0 0 ${w} ${h}`);
  svg?.setAttribute('preserveAspectRatio', 'xMinYMin meet');
}

// ── reading aid ─────────────────────────────────────────────────────────────────────────────────

const fmt = (x: number | null | undefined, d = 4): string => (x === null || x === undefined || Number.isNaN(x) ? '—' : Number.isFinite(x) ? String(Number(x.toPrecision(d))) : '∞');

function pointerReading(ev: PointerEvent): void {
  if (!view || !current) return;
  const el = $('chart').querySelector('svg, canvas');
  if (!el) return;
  // the drawing is scaled to the page's width: back to the view's own units
  const box = el.getBoundingClientRect();
  const live = liveTemplateParams(current.built.template).layout;
  const k = live.page.w / box.width;
  const [ox, oy] = view.origin();
  readAtPlot((ev.clientX - box.left) * k - ox, (ev.clientY - box.top) * k - oy);
}

/** The keyboard's reading point, in the plot's own units (null: none yet). */
let keyPoint: { x: number; y: number } | null = null;

/** Arrow keys move a reading point over the plot (Shift: ten times the step); Home puts it mid-plot; Escape hides it. */
function keyReading(ev: KeyboardEvent): void {
  if (!view || !current) return;
  const L = liveTemplateParams(current.built.template).layout.plot;
  const step = (ev.shiftKey ? 0.1 : 0.01) * Math.min(L.w, L.h);
  const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
  if (ev.key === 'Escape') {
    keyPoint = null;
    $('crosshair').hidden = true;
    return;
  }
  if (ev.key !== 'Home' && !moves[ev.key]) return;
  ev.preventDefault();
  const at = ev.key === 'Home' || !keyPoint ? { x: L.w / 2, y: L.h / 2 } : keyPoint;
  const [dx, dy] = moves[ev.key] ?? [0, 0];
  keyPoint = { x: Math.min(L.w, Math.max(0, at.x + dx)), y: Math.min(L.h, Math.max(0, at.y + dy)) };
  readAtPlot(keyPoint.x, keyPoint.y);
}

/** The reading at a point of the plot (the view's units, from the plot's top left), with the crosshair on it. */
function readAtPlot(x: number, y: number): void {
  if (!view || !current) return;
  const el = $('chart').querySelector('svg, canvas');
  if (!el) return;
  const L = liveTemplateParams(current.built.template).layout.plot;
  const hair = $('crosshair');
  if (x < 0 || y < 0 || x > L.w || y > L.h) {
    hair.hidden = true;
    return;
  }
  const M = (view.scale('x') as unknown as { invert(v: number): number }).invert(x);
  const P = (view.scale('y') as unknown as { invert(v: number): number }).invert(y);
  const r = readingAt(current, M, P);
  const su = DISPLAY_UNITS[current.request.section.units].stress;
  const sy = current.request.section.basis.symbols;
  const rho =
    r.reading.position === 'between' ? fmt(r.reading.rho) : r.reading.position === 'inside-lowest' ? `≤ ${fmt(r.reading.rho)}` : `> ${fmt(current.family.curves[current.family.curves.length - 1]?.rho)}`;
  const d = current.request.section.shape.kind === 'circle' ? 'D' : 'h';
  const chartUnits = current.divisor === 1 ? '' : ` (chart axes: ${fmt(M)}, ${fmt(P)})`;
  $('reading').textContent = `P/Ag ${fmt(r.P)} ${su} · M/(Ag·${d}) ${fmt(r.M)} ${su}${chartUnits} · e/${d} ${fmt(r.eOverH, 3)} · ρg ${rho} (read on the ${sy.designFamily} curves at γ ${fmt(current.family.gamma)})`;
  // back from the view's units to the page's pixels
  const box = el.getBoundingClientRect();
  const wrap = $('chart-wrap').getBoundingClientRect();
  const k = liveTemplateParams(current.built.template).layout.page.w / box.width;
  const [ox, oy] = view.origin();
  hair.style.left = `${box.left - wrap.left + (x + ox) / k}px`;
  hair.style.top = `${box.top - wrap.top + (y + oy) / k}px`;
  hair.hidden = false;
}

// ── tables and text ─────────────────────────────────────────────────────────────────────────────

const cell = (v: unknown, d = 4, cls = ''): string =>
  `<td${cls ? ` class="${cls}"` : ''} data-value="${v === null || v === undefined ? '' : esc(String(v))}">${typeof v === 'number' ? fmt(v, d) : v === null || v === undefined ? '—' : esc(String(v))}</td>`;

function loadsTable(check: CheckJson): string {
  const u = check.units as { force: string; moment: string; stress: string; area: string };
  const d = (check.section as { shape: { kind: string } }).shape.kind === 'circle' ? 'D' : 'h';
  const biax = check.results.some((r) => r.biaxial != null);
  const head = ['id', `Pu ${u.force}`, `Mu ${u.moment}`, `P/Ag ${u.stress}`, `M/(Ag·${d}) ${u.stress}`, `e/${d}`, 'ρg required', ...(biax ? ['ρg req biax', 'ρg chart biax'] : []), 'ρg chart', 'ρg rounded', `steel cost ${u.area}`, 'status'];
  const rows = check.results.map((r) => {
    const n = r.normalised as { P: number; M: number; eOverH: number | null };
    const b = r.biaxial as { rhoRequired: number | null; rhoFromChart: number | null } | null | undefined;
    // the check engine's status, its reason, and the notes (the CLI's words)
    const status = [String(r.status), String(r.statusReason ?? ''), ...((r.notes as string[]) ?? [])].filter(Boolean).join('; ');
    return `<tr class="${r.governing ? 'governing' : ''}" data-id="${esc(String(r.id))}">${cell(`${r.governing ? '◆ ' : ''}${String(r.id)}`)}${cell(r.Pu, 5)}${cell(r.Mu, 5)}${cell(n.P)}${cell(n.M)}${cell(n.eOverH, 3)}${cell(r.rhoRequired, 4, 'rho-required')}${biax ? cell(b?.rhoRequired ?? null, 4, 'rho-required-biaxial') + cell(b?.rhoFromChart ?? null, 4, 'rho-chart-biaxial') : ''}${cell(r.rhoFromChart, 4, 'rho-chart')}${cell(r.rhoRoundedDown, 3, 'rho-rounded')}${cell(r.extraSteelRoundedDown, 3, 'steel-cost')}${cell(status, 4, 'status')}</tr>`;
  });
  const chart = check.chart as { sheets: number[]; gammaStep: number };
  return `<table id="results"><thead><tr>${head.map((h) => `<th>${esc(h)}</th>`).join('')}</tr></thead><tbody>${rows.join('')}</tbody></table>
<p class="muted">◆ governing load. Chart readings as read on the printed sheets γ = ${chart.sheets.join(' and ')} (grid ${chart.gammaStep}); rounded: the next lower sheet, next curve out; steel cost: what that rounding adds over the exact ρg.</p>`;
}

function assumptions(cv: ChartView, check: CheckJson | null): void {
  const b = cv.request.section.basis;
  const items = [`${b.title}.`, ...b.notes, ...(check ? check.assumptions : []), PAGE_CAUTION];
  $('assumptions').innerHTML = items.map((t) => `<li>${esc(t)}</li>`).join('');
}

/** What the faint families are, for the page and for the exported sheet. */
function sheetsText(cv: ChartView): string {
  const g = cv.sheets.map((s) => s.gamma);
  const exact = fmt(cv.family.gamma);
  return $<HTMLInputElement>('show-sheets').checked
    ? g.length === 2
      ? `Faint grey families: the printed sheets γ = ${g[0]} and ${g[1]} of the ${grid()} grid; coloured: the exact γ = ${exact}.`
      : `γ = ${exact} sits on the ${grid()} grid: the printed sheet is the exact family.`
    : '';
}

function sheetsNote(cv: ChartView): void {
  $('sheets-note').textContent = sheetsText(cv);
}

function commands(cv: ChartView, fields: PageFields, loads: PageLoads | null): void {
  $('cmd-sheet').textContent = commandLine('sheet', fields as Record<string, unknown>, ['--out', 'sheet.pdf']);
  $('cmd-check').textContent = loads
    ? commandLine('check', checkFlags(fields, loads, grid()) as Record<string, unknown>).replace('pasted-loads.csv', 'loads.csv') + (loads.kind === 'csv' ? '    # save the pasted CSV as loads.csv' : '')
    : 'pmchart check … (enter loads and b·h to get this line)';
  $('set-json').textContent = chartSetSnippet(cv, fields);
}

// ── biaxial view ────────────────────────────────────────────────────────────────────────────────

let biaxView: vega.View | null = null;
let biaxKey = '';
let currentBiax: BiaxialView | null = null;
let currentBiaxRows: BiaxialRow[] = [];
/** the load the user picked for the biaxial view; unset: the governing one (the first with a reading) */
let biaxChosen: string | undefined;

/** The axis and level words of the biaxial panels, in the basis's symbols (as the sheets' axis titles). */
function biaxialWords(v: BiaxialView, divisor: number, units: UnitSystem): BiaxialWords {
  const sy = v.family.basis.symbols;
  const circle = v.family.shape.kind === 'circle';
  const ns = sy.normalisingStress;
  const su = DISPLAY_UNITS[units].stress;
  const M = sy.designMoment;
  const axis = (a: 'x' | 'y', d: string) => (divisor === 1 ? `${M}${a} / (Ag · ${d})   (${su})` : `${M}${a} / (${ns} · Ag · ${d})   (dimensionless)`);
  return { levelName: sy.dimensionlessAxial ?? `P/(${ns}·Ag)`, x: axis('x', circle ? 'D' : 'h'), y: axis('y', circle ? 'D' : 'b') };
}

/** Draws the contour panels (compiled once per template, then only the rows are swapped). */
async function drawBiaxial(v: BiaxialView, words: BiaxialWords, divisor: number): Promise<void> {
  const template = biaxialTemplate(words);
  currentBiaxRows = biaxialRows(v, words, divisor);
  const key = JSON.stringify(template);
  if (!biaxView || key !== biaxKey) {
    biaxView?.finalize();
    biaxView = new vega.View(compileView(template, { biax: currentBiaxRows } as never), { expr: expressionInterpreter as never, renderer: 'svg', container: '#biaxial-chart', hover: false });
    biaxKey = key;
  } else biaxView.data('biax', currentBiaxRows);
  await biaxView.runAsync();
}

type JsonBiaxial = { rhoRequired: number | null; rhoStatus: string | null; rhoFromChart: number | null; chartMinusExact: number | null; chartLevels: { level: number; rho: number | null; position: string }[] };

/** A number with a true minus sign, for the levels (below zero for loads in tension). */
const signed = (x: number): string => fmt(x).replace(/^-/, '−');

const positionWords: Record<string, string> = { between: 'between curves', 'inside-lowest': 'inside the lowest curve', 'outside-highest': 'outside the highest curve' };

/** The readout (the check's own figures, as `pmchart check --json` prints them), the α table and the notes. */
function biaxialText(v: BiaxialView, words: BiaxialWords, check: CheckJson, divisor: number): void {
  const r = check.results.find((x) => String(x.id) === v.id)!;
  const b = r.biaxial as JsonBiaxial;
  const diff = b.chartMinusExact;
  const levels = b.chartLevels.map((l) => `${signed(l.level)} → ${l.rho === null ? '—' : fmt(l.rho)} (${positionWords[l.position] ?? l.position})`).join('; ');
  const bc = check.biaxialChart as { axialStep: number; angleStepDeg: number; rhos: number[] };
  const su = check.units as { stress: string };
  const row = (label: string, cls: string, value: unknown, text: string) => `<tr><th>${esc(label)}</th><td class="${cls}" data-value="${value === null || value === undefined ? '' : esc(String(value))}">${esc(text)}</td></tr>`;
  $('biaxial-readout').innerHTML = `<table>${[
    row('load read', 'biax-load-id', v.id, `${v.id}${r.governing ? ' ◆ governing' : ''}, ${words.levelName} = ${signed(v.level)}`),
    row(
      'ρg req biax (exact)',
      'rho-required-biaxial',
      b.rhoRequired,
      b.rhoRequired === null ? (b.rhoStatus === 'not-possible' ? `— (not possible within ρg ≤ ${fmt(Math.max(...bc.rhos))})` : '—') : `${fmt(b.rhoRequired)}${b.rhoStatus === 'minimum-governs' ? ' (the minimum governs)' : ''}`,
    ),
    row('ρg chart biax', 'rho-chart-biaxial', b.rhoFromChart, b.rhoFromChart === null ? '— (off the sheets)' : fmt(b.rhoFromChart)),
    row('chart − exact', 'chart-minus-exact', diff, diff === null ? '—' : diff === 0 ? '0' : `${diff > 0 ? '+' : '−'}${fmt(Math.abs(diff), 3)}`),
    row(`levels read (${words.levelName} step ${bc.axialStep})`, 'levels-read', b.chartLevels.map((l) => l.level).join(','), levels),
  ].join('')}</table>`;
  const f = v.family;
  const head = f.levels.map((l) => `<th colspan="4">${esc(`${words.levelName} = ${signed(l)}`)}</th>`).join('');
  const sub = f.levels.map(() => ['Mxo', 'Myo', 'α', 'misfit'].map((t) => `<th>${t}</th>`).join('')).join('');
  // moments to four significant figures at the scale of the largest (about 1 ksi, or 10 MPa)
  const top = Math.max(...f.contours.flat().filter((c) => c.reachable).map((c) => Math.max(c.mxo, c.myo) / divisor), 1e-9);
  const mDigits = Math.max(0, 3 - Math.floor(Math.log10(top)));
  const body = f.rhos
    .map((rho, k) => {
      const cells = f.levels.map((_, li) => {
        const c = f.contours[li]![k]!;
        const fixed = (x: number, d: number) => `<td data-value="${x}">${x.toFixed(d)}</td>`;
        return c.reachable
          ? `${fixed(c.mxo / divisor, mDigits)}${fixed(c.myo / divisor, mDigits)}${fixed(c.alpha, 2)}<td data-value="${c.misfit}">${(c.misfit * 100).toFixed(1)} %</td>`
          : `<td colspan="4" class="muted">beyond this ρg’s reach</td>`;
      });
      return `<tr><td class="rho">${rho}</td>${cells.join('')}</tr>`;
    })
    .join('');
  const unit = divisor === 1 ? su.stress : 'dimensionless';
  const caution = `<p class="biaxial-caution"><strong>Caution.</strong> ${esc(PAGE_CAUTION)}</p>`;
  $('biaxial-table').innerHTML = `<table id="biaxial-alpha"><thead><tr><th rowspan="2">ρg</th>${head}</tr><tr>${sub}</tr></thead><tbody>${body}</tbody></table>
<p class="muted">Mxo, Myo: the uniaxial capacities at the level (${unit}, normalised as the panels${f.quadrants === 'all' ? '; the positive faces' : ''}). α: exponent of the load contour (Mx/Mxo)^α + (My/Myo)^α = 1 (Bresler 1960) fitted to the drawn contour by least squares on its radius; misfit: the worst radial departure of that curve from the contour. Printed aids often take one α for everything; where the misfit is large the one-α shortcut is not safe.</p>${caution}`;
  const others =
    v.loads.length > 1
      ? ` Every load with Muy is drawn on each panel at its own moments, though each is read on the levels of its own ${words.levelName}, given in brackets beside its name (the loads table gives each reading; pick a load above to draw its levels).`
      : '';
  $('biaxial-note').textContent =
    `Factored Mx–My contours of the ρg family ${bc.rhos.join(', ')} at γ = ${fmt(f.gamma)}${f.gammaX !== undefined ? `, γB = ${fmt(f.gammaX)}` : ''}: the exact biaxial capacity under an inclined neutral axis with the bars smeared in the chosen arrangement, one point every ${bc.angleStepDeg}° of moment direction, straight between; a curve is left out where the level is beyond that ρg’s reach. ` +
    (f.quadrants === 'first'
      ? `The layout is symmetric about both axes, so the first quadrant tells all: loads are drawn at (|Mux|/(Ag·h), |Muy|/(Ag·b)). `
      : `The layout is not symmetric about both axes: all four quadrants are drawn and the loads keep their signs. `) +
    `Moments are those the check used (after slenderness and the minimum moment where asked). ρg chart biax reads the panels as an engineer would: linear between the two contours that bracket the load along its moment direction (dashed ray), then linear in ${words.levelName} between the two levels.` +
    others;
  const sel = $<HTMLSelectElement>('biax-load');
  const options = v.choices.map((id) => `<option value="${esc(id)}"${id === v.id ? ' selected' : ''}>${esc(id)}</option>`).join('');
  if (sel.innerHTML !== options) sel.innerHTML = options;
  sel.value = v.id;
}

/** The biaxial section for a check: shown when a load has Muy and a sheet reading, hidden otherwise. */
/** the last biaxial view and the inputs it was computed for (the grid and the drawing options do not change it) */
let biaxMemo: { key: string; view: BiaxialView | null } = { key: '', view: null };

async function updateBiaxial(check: ColumnCheck | null, json: CheckJson | null, cv: ChartView, inputs: string): Promise<void> {
  const key = JSON.stringify([inputs, biaxChosen ?? null]);
  if (key !== biaxMemo.key || !check) biaxMemo = { key, view: check && json ? biaxialView(check, biaxChosen) : null };
  const v = biaxMemo.view;
  currentBiax = v;
  $('biaxial').hidden = v === null;
  if (!v || !json) return;
  const words = biaxialWords(v, cv.divisor, cv.request.section.units);
  await drawBiaxial(v, words, cv.divisor);
  biaxialText(v, words, json, cv.divisor);
}

// ── update loop ─────────────────────────────────────────────────────────────────────────────────

let seq = 0;
let draws = 0;
/** the engine's check behind `currentCheck`, for redrawing the biaxial view at another load's levels */
let lastCheck: ColumnCheck | null = null;
let lastInputs = '';
/** updates finished, drawn or stopped at a message */
let settled = 0;
let lastMs = NaN;
let phases: Record<string, number> = {};

async function update(): Promise<void> {
  const my = ++seq;
  const t0 = performance.now();
  const fields = readFields();
  const cv = await chartView(fields, grid(), presets.date);
  const t1 = performance.now();
  if (my !== seq) return;
  clearMessages('chart');
  if (!cv.ok) {
    showProblem(cv.problem.path, cv.problem.message);
    return; // the chart keeps its last valid state
  }
  const loads = readLoads();
  clearMessages('loads');
  let check: CheckJson | null = null;
  let engineCheck: ColumnCheck | null = null;
  let effects = '';
  if (loads) {
    const lv = await loadsView(fields, loads, grid());
    if (my !== seq) return;
    if (lv.ok) ({ json: check, effectsText: effects, check: engineCheck } = lv.value);
    else showProblem(lv.problem.path, lv.problem.message);
  }
  const t2 = performance.now();
  await draw(cv.value, check);
  if (my !== seq) return;
  const t3 = performance.now();
  // the section and loads as the check reads them (not the ratio list or the γ grid, which do not move the contours)
  const { rho: _r, omega: _w, families: _f, dimensionless: _d, eccentricities: _e, paper: _p, portrait: _o, ...checkInputs } = fields;
  lastInputs = JSON.stringify([checkInputs, loads]);
  await updateBiaxial(engineCheck, check, cv.value, lastInputs);
  if (my !== seq) return;
  lastCheck = engineCheck;
  phases = { chart: t1 - t0, loads: t2 - t1, draw: t3 - t2, biaxial: performance.now() - t3 };
  current = cv.value;
  currentCheck = check;
  lastMs = performance.now() - t0;
  draws++;
  $('timing').textContent = `redrawn in ${lastMs.toFixed(0)} ms`;
  $('loads-table').innerHTML = check ? loadsTable(check) + (effects ? `<pre class="effects">${esc(effects)}</pre>` : '') : `<p class="muted">Type Pu and Mu, or paste a load CSV, with b and h (or D).</p>`;
  $('view-title').textContent = cv.value.set.sheets[0]!.title;
  sheetsNote(cv.value);
  saveState();
  assumptions(cv.value, check);
  commands(cv.value, fields, loads);
}

let queued = false;
function schedule(): void {
  if (queued) return;
  queued = true;
  requestAnimationFrame(() => {
    queued = false;
    void update()
      .catch(internalError)
      .finally(() => settled++);
  });
}

// ── the schedule panel ──────────────────────────────────────────────────────────────────────────

let scheduleSeq = 0;
let scheduleSettled = 0;
let currentSchedule: ScheduleView | null = null;

/** The marks as a table (the schedule view's own columns, as `pmchart schedule` prints them), the summary and the notes. */
function scheduleTable(v: ScheduleView): string {
  const cells = tableCells(SCHEDULE_TABLE, v.rows);
  const head = SCHEDULE_TABLE.map((c) => `<th class="${c.align}">${esc(c.heading)}</th>`).join('');
  const body = cells.map((row, i) => `<tr data-mark="${esc(v.rows[i]!.mark)}" data-status="${esc(v.rows[i]!.status)}">${row.map((x, j) => `<td class="${SCHEDULE_TABLE[j]!.align} ${SCHEDULE_TABLE[j]!.key}">${esc(x)}</td>`).join('')}</tr>`).join('');
  const notes = v.notes.length ? `<ul class="muted">${v.notes.map((n) => `<li>${esc(n)}</li>`).join('')}</ul>` : '';
  return `<table id="schedule-results"><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table><p id="schedule-summary">${esc(v.summary.text)}</p>${notes}`;
}

/** Checks the pasted schedule against its loads; both empty clears the panel. */
async function updateSchedule(): Promise<void> {
  const my = ++scheduleSeq;
  const text = $<HTMLTextAreaElement>('sched-text').value;
  const loads = $<HTMLTextAreaElement>('sched-loads').value;
  const msg = $('m-schedule');
  msg.hidden = true;
  msg.textContent = '';
  if (!text.trim() || !loads.trim()) {
    currentSchedule = null;
    $('schedule-table').innerHTML = text.trim() || loads.trim() ? '<p class="muted">Give both the schedule and its loads.</p>' : '';
    return;
  }
  const columns = $<HTMLInputElement>('sched-columns').value.trim();
  const compression = $<HTMLSelectElement>('sched-compression').value;
  const v = await scheduleView(text, loads, { ...(columns ? { columns } : {}), compression });
  if (my !== scheduleSeq) return;
  if (!v.ok) {
    currentSchedule = null;
    msg.textContent = v.problem.message;
    msg.hidden = false;
    $('schedule-table').innerHTML = '';
    return;
  }
  currentSchedule = v.value;
  $('schedule-table').innerHTML = scheduleTable(v.value);
}

function scheduleUpdate(): void {
  void updateSchedule()
    .catch(internalError)
    .finally(() => scheduleSettled++);
}

/** A file dropped on a schedule box replaces its text. */
function dropInto(id: string): void {
  const box = $<HTMLTextAreaElement>(id);
  box.addEventListener('dragover', (ev) => {
    ev.preventDefault();
    box.classList.add('over');
  });
  box.addEventListener('dragleave', () => box.classList.remove('over'));
  box.addEventListener('drop', (ev) => {
    ev.preventDefault();
    box.classList.remove('over');
    const file = ev.dataTransfer?.files[0];
    if (!file) return;
    void file.text().then((t) => {
      box.value = t;
      scheduleUpdate();
    });
  });
}

function internalError(e: unknown): void {
  const m = $('m-general');
  m.textContent = `internal error: ${e instanceof Error ? e.message : String(e)}`;
  m.hidden = false;
  console.error(e);
}

// ── export ──────────────────────────────────────────────────────────────────────────────────────

function download(name: string, href: string): void {
  const a = document.createElement('a');
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
}

/** The chart as SVG, with the caution and the basis assumptions carried in its description. */
/** The whole sheet (title block, lookup table, basis notes, caution) with the page's overlays, drawn off screen. */
function sheetView(): vega.View | null {
  if (!current || !currentData) return null;
  return new vega.View(compileView(pageChartTemplate(current.built.template), currentData), { expr: expressionInterpreter as never, renderer: 'none' });
}

async function exportSvg(): Promise<string> {
  const full = sheetView();
  if (!full || !current) return '';
  const svg = await full.toSVG();
  full.finalize();
  const b = current.request.section.basis;
  const desc = [PAGE_CAUTION, `${b.title}.`, ...b.notes, ...(currentCheck ? currentCheck.assumptions : [])].join('\n');
  return svg.replace(/<svg\b[^>]*>/, (open) => `${open}<title>pmchart live chart</title><desc>${esc(desc)}</desc>`);
}

/** The biaxial panels as SVG, carrying the caution, the panels' notes and the check's assumptions in the description. */
async function exportBiaxialSvg(): Promise<string> {
  if (!biaxView || !currentBiax) return '';
  const svg = await biaxView.toSVG();
  const b = currentBiax.family.basis;
  const desc = [PAGE_CAUTION, `${b.title}.`, $('biaxial-note').textContent ?? '', ...(currentCheck ? currentCheck.assumptions : [])].join('\n');
  return svg.replace(/<svg\b[^>]*>/, (open) => `${open}<title>pmchart biaxial contours, load ${esc(currentBiax!.id)}</title><desc>${esc(desc)}</desc>`);
}

function wire(): void {
  const form = $('inputs');
  form.addEventListener('input', (ev) => {
    const t = ev.target as HTMLElement;
    if (t.id === 'gamma-slider') control('gamma').value = (t as HTMLInputElement).value;
    if (t.id === 'f-gamma') {
      const v = Number(control('gamma').value);
      if (Number.isFinite(v)) $<HTMLInputElement>('gamma-slider').value = String(v);
    }
    schedule();
  });
  form.addEventListener('change', schedule);
  form.addEventListener('submit', (ev) => ev.preventDefault());
  $('clear-loads').addEventListener('click', () => {
    for (const k of ['pu', 'mu', 'muy', 'loads']) control(k).value = '';
    schedule();
  });
  $('biax-load').addEventListener('change', () => {
    biaxChosen = $<HTMLSelectElement>('biax-load').value || undefined;
    if (current) void updateBiaxial(lastCheck, currentCheck, current, lastInputs).catch(internalError).finally(() => settled++);
  });
  $('chart').addEventListener('pointermove', pointerReading);
  $('chart').addEventListener('pointerleave', () => ($('crosshair').hidden = true));
  $('chart-wrap').addEventListener('keydown', keyReading);
  $('save-loads').addEventListener('click', () => {
    const loads = readLoads();
    if (loads) download('pmchart-loads.csv', URL.createObjectURL(new Blob([loadsCsv(loads)], { type: 'text/csv' })));
  });
  $('export-svg').addEventListener('click', () => {
    void exportSvg().then((svg) => download('pmchart-chart.svg', URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }))));
  });
  $('export-biaxial-svg').addEventListener('click', () => {
    void exportBiaxialSvg().then((svg) => download('pmchart-biaxial.svg', URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }))));
  });
  $('export-png').addEventListener('click', () => {
    const full = sheetView();
    void full?.toImageURL('png', 2).then((url) => {
      full.finalize();
      download('pmchart-chart.png', url);
    });
  });
  $('print').addEventListener('click', () => window.print());
  for (const id of ['sched-text', 'sched-loads', 'sched-columns']) $(id).addEventListener('input', scheduleUpdate);
  $('sched-compression').addEventListener('change', scheduleUpdate);
  dropInto('sched-text');
  dropInto('sched-loads');
}

/** Hooks for the browser tests and the bench (read-only views of what the page holds). */
declare global {
  interface Window {
    pmchartPage: unknown;
  }
}
window.pmchartPage = {
  family: () =>
    current && {
      gamma: current.family.gamma,
      cOverH: Array.from(current.family.sweep.cOverH),
      curves: current.family.curves.map((c) => ({ rho: c.rho, Pn: Array.from(c.Pn), Mn: Array.from(c.Mn), phiPn: Array.from(c.phiPn), phiMn: Array.from(c.phiMn), keyPoints: c.keyPoints })),
    },
  check: () => currentCheck,
  /** the biaxial view as drawn: the load read, its levels, and per panel the ρg of every curve drawn */
  biaxial: () =>
    currentBiax && {
      id: currentBiax.id,
      level: currentBiax.level,
      quadrants: currentBiax.family.quadrants,
      levels: currentBiax.family.levels,
      reachable: currentBiax.family.contours.map((row) => row.filter((c) => c.reachable).map((c) => c.rho)),
      drawn: [...new Set(currentBiaxRows.filter((r) => r.kind === 'contour').map((r) => r.panel))].map((panel) => ({
        panel,
        rhos: [...new Set(currentBiaxRows.filter((r) => r.kind === 'contour' && r.panel === panel).map((r) => r.rho))],
      })),
    },
  draws: () => draws,
  settled: () => settled,
  lastMs: () => lastMs,
  phases: () => ({ ...phases, compiles }),
  exportSvg,
  exportBiaxialSvg,
  /** sets a field as a user would and resolves when the page has redrawn (or given up with a message) */
  set: (key: string, value: string) => {
    const el = key === 'grid' || key === 'biax-load' ? $<HTMLSelectElement>(key) : control(key);
    el.value = value;
    el.dispatchEvent(new Event(key === 'biax-load' ? 'change' : 'input', { bubbles: true }));
  },
  update: () => update(),
  /** the schedule panel's marks as checked (null when empty or refused), and how many of its updates have finished */
  schedule: () => currentSchedule && { rows: currentSchedule.rows.map((r) => ({ mark: r.mark, status: r.status, utilisation: r.utilisation, governing: r.governing })), summary: currentSchedule.summary, exitCode: currentSchedule.exitCode },
  scheduleSettled: () => scheduleSettled,
};

fillForm();
wire();
void update().catch(internalError);
