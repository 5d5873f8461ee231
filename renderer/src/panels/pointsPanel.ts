// Step 2 — service entries and points of connection: tools to add them on the canvas, the list
// with their utilities, delete, and import from a services CSV.

import type { UtilitySetting } from '../../../core/settings';
import type { PointInput } from '../../../core/site/site';
import { h, fmt } from '../dom';
import type { ProjectStore } from '../state/history';
import type { Tool, UiStore } from '../state/ui';

export interface PointsPanelDeps {
  store: ProjectStore;
  ui: UiStore;
  utilities: readonly UtilitySetting[];
  importCsv(): void;
}

const TOOLS: { tool: Tool; label: string; hint: string }[] = [
  { tool: 'select', label: 'Pick / move', hint: 'Click a point to select it; drag it to move it.' },
  { tool: 'add-service', label: 'Add service on a wall', hint: 'Click near a building wall: the service entry snaps onto the nearest wall.' },
  { tool: 'add-connection', label: 'Add connection point', hint: 'Click where a utility will be connected (a point of connection).' },
  { tool: 'pan', label: 'Pan', hint: 'Drag to move the view. Space+drag pans with any tool.' },
];

export function renderPointsPanel(el: HTMLElement, deps: PointsPanelDeps): void {
  const { store, ui, utilities } = deps;
  const { tool, selectedPoint } = ui.get();
  el.append(h('h2', {}, 'Service and connection points'));
  const toolRow = h('div', { className: 'row-actions', role: 'toolbar' },
    ...TOOLS.map((t) => h('button', {
      className: t.tool === tool ? 'primary' : '',
      'data-tool': t.tool,
      title: t.hint,
      onclick: () => ui.set({ tool: t.tool }),
    }, t.label)));
  el.append(toolRow);
  el.append(h('p', { className: 'hint' }, TOOLS.find((t) => t.tool === tool)?.hint ?? ''));
  el.append(h('div', { className: 'row-actions' },
    h('button', { id: 'import-points', onclick: () => deps.importCsv() }, 'Import points from CSV…'),
    h('button', {
      id: 'delete-point', disabled: !selectedPoint,
      onclick: () => { if (selectedPoint) { store.edit({ kind: 'remove-point', id: selectedPoint }); ui.set({ selectedPoint: null }); } },
    }, 'Delete selected')));

  const points = store.get().points;
  if (points.length === 0) {
    el.append(h('div', { className: 'message' }, 'No points yet. Add a point of connection and the service entries of the buildings, or import a CSV.'));
    return;
  }
  const services = points.filter((p) => p.role === 'service').length;
  el.append(h('p', { className: 'hint' }, `${services} services, ${points.length - services} connection points.`));
  const head = h('tr', {}, h('th', {}, 'Id'), h('th', {}, 'Kind'), ...utilities.map((u) =>
    h('th', { title: u.label }, h('span', { className: 'swatch', style: `background:${u.color}` }), u.key.slice(0, 3))));
  const rows = points.map((p) => pointRow(p, p.id === selectedPoint, utilities, store, ui));
  el.append(h('table', { id: 'points-table' }, h('thead', {}, head), h('tbody', {}, ...rows)));
  const sel = points.find((p) => p.id === selectedPoint);
  if (sel) el.append(h('p', { className: 'hint', id: 'selected-xy' }, `${sel.id}: X ${fmt(sel.x, 3)}  Y ${fmt(sel.y, 3)} (drawing units)`));
}

function pointRow(p: PointInput, selected: boolean, utilities: readonly UtilitySetting[], store: ProjectStore, ui: UiStore): HTMLTableRowElement {
  const cells = utilities.map((u) => {
    const box = h('input', {
      type: 'checkbox', checked: p.utilities.includes(u.key), 'aria-label': `${p.id} carries ${u.label}`,
      onchange: (ev: Event) => {
        const on = (ev.target as HTMLInputElement).checked;
        const next = utilities.map((x) => x.key).filter((k) => (k === u.key ? on : p.utilities.includes(k)));
        if (next.length === 0) { ui.set({ message: { kind: 'warn', text: `${p.id} must carry at least one utility.` } }); (ev.target as HTMLInputElement).checked = true; return; }
        store.edit({ kind: 'update-point', id: p.id, patch: { utilities: next } });
      },
    });
    return h('td', {}, box);
  });
  return h('tr', {
    className: selected ? 'selected' : '', 'data-point': p.id,
    onclick: (ev: Event) => { if (!(ev.target instanceof HTMLInputElement)) ui.set({ selectedPoint: p.id }); },
  }, h('td', {}, p.id), h('td', {}, p.role === 'service' ? 'service' : 'connection'), ...cells);
}
