// Step 4 — run the router (in a worker, with progress and cancel) and read the result: figures
// beside the previous run, what the colours mean, warnings, and the verification notice.

import type { UtilitySetting } from '../../../core/settings';
import { h, fmt } from '../dom';
import type { RunFigures } from '../results/runRecord';
import type { RunsStore } from '../state/runs';
import { noticeBox } from './noticeBox';

export interface ResultsPanelDeps {
  runs: RunsStore;
  utilities: readonly UtilitySetting[];
  canRun(): string | null;
  run(): void;
  cancel(): void;
}

const STAGE_LABEL: Record<string, string> = {
  read: 'Reading inputs', site: 'Understanding the site', place: 'Placing points', route: 'Searching for the network',
  takeoff: 'Computing the take-off', write: 'Writing drawings and schedules', start: 'Starting',
};

/** Rows of the comparison: label, getter, decimals, and whether smaller is better. */
const ROWS: { label: string; get: (f: RunFigures) => number; dec: number; unit: 'len' | 'money' | '' | '%' | 'ms' }[] = [
  { label: 'Trench length', get: (f) => f.length, dec: 1, unit: 'len' },
  { label: '— under pavement', get: (f) => f.lengthUnderPavement, dec: 1, unit: 'len' },
  { label: 'Bends', get: (f) => f.bends, dec: 0, unit: '' },
  { label: 'Crossings', get: (f) => f.crossings, dec: 0, unit: '' },
  { label: 'Pull boxes', get: (f) => f.pullBoxes, dec: 0, unit: '' },
  { label: 'Route cost', get: (f) => f.routeCost, dec: 1, unit: 'len' },
  { label: 'Lower bound', get: (f) => f.lowerBound, dec: 1, unit: 'len' },
  { label: 'Gap to bound', get: (f) => f.gap * 100, dec: 1, unit: '%' },
  { label: 'Take-off total', get: (f) => f.takeoffTotal, dec: 0, unit: 'money' },
  { label: 'Run time', get: (f) => f.runtimeMs, dec: 0, unit: 'ms' },
];

export function renderResultsPanel(el: HTMLElement, deps: ResultsPanelDeps): void {
  const { runs } = deps;
  const s = runs.get();
  el.append(h('h2', {}, 'Route and results'));
  const blocker = deps.canRun();
  el.append(h('div', { className: 'row-actions' },
    h('button', { id: 'run-route', className: 'primary', disabled: !!blocker || !!s.running, onclick: () => deps.run() }, s.current ? 'Run again' : 'Run'),
    h('button', { id: 'cancel-run', disabled: !s.running, onclick: () => deps.cancel() }, 'Cancel')));
  if (blocker && !s.running) el.append(h('div', { className: 'message warn' }, blocker));
  if (s.running) {
    const bar = h('div', { className: 'progress' }, h('div', { style: `width:${Math.round(s.running.fraction * 100)}%` }));
    el.append(h('div', { id: 'run-progress' }, `${STAGE_LABEL[s.running.stage] ?? s.running.stage} … ${Math.round(s.running.fraction * 100)} %`, bar));
  }
  if (s.lastError) el.append(h('div', { className: 'message error', id: 'run-error' }, s.lastError));
  const cur = s.current;
  if (!cur) {
    if (!s.running) el.append(h('div', { className: 'message' }, 'No route yet. Check the layers and points, then press Run.'));
    return;
  }
  if (s.stale) el.append(h('div', { className: 'message warn' }, 'The project changed after this run; run again to update the results.'));
  const units = cur.output.summary.units;
  const money = cur.output.summary.cost.currency;
  const unitOf = (u: string): string => (u === 'len' ? units : u === 'money' ? money : u === 'ms' ? 'ms' : u === '%' ? '%' : '');
  const prev = s.previous;
  const head = h('tr', {}, h('th', {}, ''), h('th', { className: 'num' }, `Run ${cur.id}`), prev ? h('th', { className: 'num' }, `Run ${prev.id}`) : null, h('th', {}, ''));
  const body = ROWS.map((r) => {
    const a = r.get(cur.figures);
    const b = prev ? r.get(prev.figures) : null;
    const better = b !== null && r.unit !== 'ms' && a < b;
    return h('tr', {},
      h('td', {}, r.label),
      h('td', { className: `num${better ? ' better' : ''}`, 'data-figure': r.label }, fmt(a, r.dec)),
      prev ? h('td', { className: 'num' }, fmt(b!, r.dec)) : null,
      h('td', { className: 'unit' }, unitOf(r.unit)));
  });
  el.append(h('table', { className: 'compare', id: 'run-figures' }, h('thead', {}, head), h('tbody', {}, ...body)));
  el.append(h('p', { className: 'hint', id: 'services-connected' },
    `${cur.figures.servicesConnected} of ${cur.figures.servicesTotal} services connected.`));
  const legend = h('div', { className: 'legend-list' }, ...deps.utilities
    .filter((u) => cur.view.segments.some((s) => s.utilities.includes(u.key)))
    .map((u) => h('div', {}, h('span', { className: 'swatch', style: `background:${u.color}` }), u.label)));
  el.append(h('h3', {}, 'Colours (APWA)'), legend,
    h('p', { className: 'hint' }, 'White band: proposed trench. Squares: pull boxes. Rings: bends. Crosses: crossings.'));
  const warnings = cur.output.summary.warnings;
  if (warnings.length) {
    el.append(h('h3', {}, `Warnings (${warnings.length})`));
    for (const w of warnings.slice(0, 30)) el.append(h('div', { className: 'message warn' }, w));
  }
  el.append(noticeBox());
}
