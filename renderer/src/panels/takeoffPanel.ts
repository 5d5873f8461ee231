// Step 5 — the take-off: line items grouped, sortable, with totals and units; and the exports.

import { LINE_GROUPS, type TakeOffLine } from '../../../core/takeoff/takeoff';
import { h, fmt } from '../dom';
import type { RunsStore } from '../state/runs';
import { noticeBox } from './noticeBox';

export type ExportKind = 'dxf-merged' | 'dxf-layers' | 'xlsx' | 'csv' | 'pdf';

export interface TakeoffPanelDeps {
  runs: RunsStore;
  exportFile(kind: ExportKind): void;
}

type SortKey = 'group' | 'description' | 'quantity' | 'unitPrice' | 'cost';
let sort: { key: SortKey; desc: boolean } = { key: 'group', desc: false };

export function renderTakeoffPanel(el: HTMLElement, deps: TakeoffPanelDeps): void {
  el.append(h('h2', {}, 'Take-off and exports'));
  const cur = deps.runs.get().current;
  if (!cur) {
    el.append(h('div', { className: 'message' }, 'Run the route first; the quantities come from the routed network.'));
    return;
  }
  const t = cur.output.takeOff;
  el.append(h('div', { className: 'row-actions', id: 'exports' },
    h('button', { 'data-export': 'dxf-merged', onclick: () => deps.exportFile('dxf-merged') }, 'DXF (merged)'),
    h('button', { 'data-export': 'dxf-layers', onclick: () => deps.exportFile('dxf-layers') }, 'DXF (trench layers)'),
    h('button', { 'data-export': 'xlsx', onclick: () => deps.exportFile('xlsx') }, 'XLSX'),
    h('button', { 'data-export': 'csv', onclick: () => deps.exportFile('csv') }, 'CSV'),
    h('button', { 'data-export': 'pdf', onclick: () => deps.exportFile('pdf') }, 'PDF report')));
  el.append(noticeBox());

  const groupIndex = (l: TakeOffLine): number => LINE_GROUPS.indexOf(l.group);
  const cmp: Record<SortKey, (a: TakeOffLine, b: TakeOffLine) => number> = {
    group: (a, b) => groupIndex(a) - groupIndex(b),
    description: (a, b) => (a.description < b.description ? -1 : a.description > b.description ? 1 : 0),
    quantity: (a, b) => a.quantity - b.quantity,
    unitPrice: (a, b) => a.unitPrice - b.unitPrice,
    cost: (a, b) => a.cost - b.cost,
  };
  const lines = t.lines.map((l, i) => ({ l, i })).sort((a, b) => {
    const c = cmp[sort.key](a.l, b.l) * (sort.desc ? -1 : 1);
    return c !== 0 ? c : a.i - b.i; // stable: original order breaks ties
  }).map((x) => x.l);

  const th = (key: SortKey, label: string, num = false): HTMLElement => h('th', {
    className: `sortable${num ? ' num' : ''}`, 'data-sort': key,
    onclick: () => { sort = { key, desc: sort.key === key ? !sort.desc : key !== 'group' && key !== 'description' }; rerender(); },
  }, label, sort.key === key ? (sort.desc ? ' ▾' : ' ▴') : '');
  const rows: HTMLElement[] = [];
  let lastGroup = '';
  for (const l of lines) {
    if (sort.key === 'group' && l.group !== lastGroup) {
      lastGroup = l.group;
      const sub = t.lines.filter((x) => x.group === l.group).reduce((a, x) => a + x.cost, 0);
      rows.push(h('tr', { className: 'group' }, h('td', { colspan: 3 }, h('strong', {}, l.group)), h('td', {}), h('td', { className: 'num' }, fmt(sub, 2))));
    }
    rows.push(h('tr', { 'data-line': l.key },
      h('td', {}, l.description),
      h('td', { className: 'num' }, fmt(l.quantity, 2)),
      h('td', {}, l.unit),
      h('td', { className: 'num' }, l.priceKey ? fmt(l.unitPrice, 2) : '—'),
      h('td', { className: 'num' }, fmt(l.cost, 2))));
  }
  rows.push(h('tr', { className: 'total' }, h('td', { colspan: 4 }, `Total (${t.currency})`), h('td', { className: 'num', id: 'takeoff-total' }, fmt(t.totals.cost, 2))));
  const table = h('table', { id: 'takeoff-table' },
    h('thead', {}, h('tr', {}, th('description', 'Item'), th('quantity', 'Qty', true), h('th', {}, 'Unit'), th('unitPrice', 'Price', true), th('cost', `Cost`, true))),
    h('tbody', {}, ...rows));
  const holder = h('div', {}, table);
  el.append(h('p', { className: 'hint' }, `Click a column to sort; "Item" sorts by name, the first view groups by kind. Lengths in ${t.labels.length}, areas in ${t.labels.area}, volumes in ${t.labels.volume}. Prices are placeholders until you enter your own.`));
  el.append(holder);
  el.append(h('div', { className: 'row-actions' }, h('button', { id: 'group-by-kind', onclick: () => { sort = { key: 'group', desc: false }; rerender(); } }, 'Group by kind')));

  el.append(h('h3', {}, 'Totals'));
  const tot = t.totals;
  el.append(h('table', {}, h('tbody', {},
    ...([
      ['Trench', tot.trenchLength, t.labels.length], ['— soft ground', tot.lengthSoft, t.labels.length], ['— under pavement', tot.lengthPavement, t.labels.length],
      ['Excavation', tot.excavation, t.labels.volume], ['Bedding', tot.bedding, t.labels.volume], ['Backfill', tot.backfill, t.labels.volume],
      ['Haul-off', tot.haul, t.labels.volume], ['Saw-cut', tot.sawCut, t.labels.length], ['Pavement restoration', tot.restoration, t.labels.area],
      ['Crossings', tot.crossings, ''], ['Pull boxes', tot.pullBoxes, ''],
    ] as [string, number, string][]).map(([k, v, u]) => h('tr', {}, h('td', {}, k), h('td', { className: 'num' }, fmt(v, 2)), h('td', {}, u))))));

  function rerender(): void {
    while (el.firstChild) el.removeChild(el.firstChild);
    renderTakeoffPanel(el, deps);
  }
}
