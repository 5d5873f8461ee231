// Step 1 — the drawing's layers with their roles: the suggestion and its reason, a role picker,
// visibility, the unit choice for unitless drawings, and what the site model made of it.

import type { Drawing } from '../../../core/dxf/drawing';
import { LAYER_ROLES, type LayerRole } from '../../../core/site/site';
import type { SiteModel } from '../documents/siteModel';
import { h } from '../dom';
import type { ProjectStore } from '../state/history';
import type { UiStore } from '../state/ui';
import { ROLE_COLOR, ROLE_LABEL } from '../theme';

export interface LayersPanelDeps {
  store: ProjectStore;
  ui: UiStore;
  drawing: Drawing;
  model: SiteModel;
}

export function renderLayersPanel(el: HTMLElement, deps: LayersPanelDeps): void {
  const { store, ui, drawing, model } = deps;
  const state = store.get();
  const counts = new Map<string, number>();
  for (const e of drawing.entities) counts.set(e.layer, (counts.get(e.layer) ?? 0) + 1);
  const suggestions = model.suggestions();
  const hidden = ui.get().hiddenLayers;

  el.append(h('h2', {}, 'Layers and what they are'));
  el.append(h('p', { className: 'hint' }, 'Each layer plays one role in routing. Furrow suggests a role from the layer name and its shapes; change any of them.'));

  const rows = drawing.layers.filter((l) => counts.has(l.name)).map((layer) => {
    const role = state.roles[layer.name] ?? 'ignore';
    const sug = suggestions.get(layer.name);
    const select = h('select', {
      'data-layer': layer.name,
      'aria-label': `Role of layer ${layer.name}`,
      onchange: (ev: Event) => { store.edit({ kind: 'set-role', layer: layer.name, role: (ev.target as HTMLSelectElement).value as LayerRole }); },
    }, ...LAYER_ROLES.map((r) => h('option', { value: r, selected: r === role }, ROLE_LABEL[r])));
    select.value = role;
    const eye = h('input', {
      type: 'checkbox', checked: !hidden.has(layer.name), title: 'Show this layer',
      onchange: (ev: Event) => {
        const next = new Set(ui.get().hiddenLayers);
        if ((ev.target as HTMLInputElement).checked) next.delete(layer.name); else next.add(layer.name);
        ui.set({ hiddenLayers: next });
      },
    });
    const differs = sug && sug.role !== role;
    return h('tr', { 'data-layer-row': layer.name },
      h('td', {}, eye),
      h('td', {},
        h('span', { className: 'swatch', style: `background:#${ROLE_COLOR[role].toString(16).padStart(6, '0')}` }),
        layer.name,
        h('div', { className: 'reason' },
          sug ? `${differs ? 'Suggested: ' + ROLE_LABEL[sug.role] + ' — ' : ''}${sug.reason}` : 'No suggestion'),
      ),
      h('td', { className: 'num' }, String(counts.get(layer.name) ?? 0)),
      h('td', {}, select),
    );
  });
  el.append(h('table', { className: 'layers' },
    h('thead', {}, h('tr', {}, h('th', {}, ''), h('th', {}, 'Layer'), h('th', { className: 'num' }, 'Items'), h('th', {}, 'Role'))),
    h('tbody', {}, ...rows)));

  const applyAll = h('button', {
    onclick: () => {
      for (const [layer, s] of suggestions) store.edit({ kind: 'set-role', layer, role: s.role });
    },
  }, 'Use all suggestions');
  el.append(h('div', { className: 'row-actions' }, applyAll));

  el.append(h('h3', {}, 'Units'));
  const unitSel = h('select', {
    'aria-label': 'Routing units',
    onchange: (ev: Event) => {
      const v = (ev.target as HTMLSelectElement).value;
      store.edit({ kind: 'set-units', units: v === 'm' || v === 'ft' ? v : null });
    },
  },
  h('option', { value: '' }, 'From the drawing'),
  h('option', { value: 'm' }, 'Metres'),
  h('option', { value: 'ft' }, 'Feet'));
  unitSel.value = state.units ?? '';
  el.append(h('div', { className: 'field' }, h('label', {}, `Drawing says $INSUNITS = ${drawing.header.insUnits}`), unitSel, h('span', {})));

  el.append(h('h3', {}, 'Site found'));
  const site = model.site(state.roles, state.units);
  if (!site.ok) {
    el.append(h('div', { className: 'message error', id: 'site-status' }, site.error.message));
  } else {
    const s = site.value;
    el.append(h('div', { className: 'message', id: 'site-status' },
      `${s.buildings.length} buildings, ${s.keepOuts.length} keep-out areas, ${s.pavements.length} pavement areas, ${s.crossings.length} lines to cross; routing in ${s.units === 'm' ? 'metres' : 'feet'}.`));
    for (const w of s.warnings.slice(0, 8)) el.append(h('div', { className: 'message warn' }, w));
  }
}
