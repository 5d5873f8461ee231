// Step 3 — route settings with units and defaults (ranges from core/settingsFile.ts), and the
// utilities to route, each in its APWA colour.

import { ROUTE_FIELDS } from '../../../core/settingsFile';
import { DEFAULT_ROUTE, type RouteSettings, type UtilitySetting } from '../../../core/settings';
import { h } from '../dom';
import type { ProjectStore } from '../state/history';
import type { UiStore } from '../state/ui';

const LABELS: Record<keyof RouteSettings, string> = {
  style: 'Geometry',
  cellM: 'Grid cell size',
  clearanceM: 'Clearance from buildings',
  pavementFactor: 'Cost factor under pavement',
  crossingPenaltyM: 'Penalty per crossing',
  bendPenaltyM: 'Penalty per 90° bend',
  snapToleranceM: 'Snap distance to a wall',
  timeBudgetMs: 'Time budget for the search',
  seed: 'Random seed',
};

const STYLE_LABELS: Record<string, string> = {
  orthogonal: 'Right angles only', octilinear: '45° and 90° fittings', 'any-angle': 'Any angle',
};

/** The autosave interval: an app preference (not part of the project, not undoable). */
export interface AutosavePref { minutes: number; setMinutes(m: number): void }
export const AUTOSAVE_MINUTES_RANGE = { min: 0.5, max: 120 } as const;

export function renderSettingsPanel(el: HTMLElement, deps: { store: ProjectStore; ui: UiStore; utilities: readonly UtilitySetting[]; autosave?: AutosavePref }): void {
  const { store, ui, utilities } = deps;
  const route = store.get().route;
  el.append(h('h2', {}, 'Route settings'));
  el.append(h('p', { className: 'hint' }, 'Penalties are in metres of trench: a bend "costs" as much as that length of straight trench.'));
  for (const key of Object.keys(LABELS) as (keyof RouteSettings)[]) {
    const field = ROUTE_FIELDS[key];
    if (!field) continue;
    if (field.type === 'enum') {
      const sel = h('select', {
        'data-setting': key,
        onchange: (ev: Event) => { store.edit({ kind: 'set-route', key, value: (ev.target as HTMLSelectElement).value as RouteSettings['style'] }); },
      }, ...field.values.map((v) => h('option', { value: v }, STYLE_LABELS[v] ?? v)));
      sel.value = String(route[key]);
      el.append(h('div', { className: 'field' }, h('label', {}, LABELS[key]), sel, h('span', {})));
      continue;
    }
    if (field.type !== 'number') continue;
    const input = h('input', {
      type: 'number', 'data-setting': key, value: String(route[key]), min: field.min, max: field.max,
      step: field.integer ? 1 : 'any', title: `Default ${String(DEFAULT_ROUTE[key])} ${field.unit}; allowed ${field.min}–${field.max}`,
      onchange: (ev: Event) => {
        const t = ev.target as HTMLInputElement;
        const v = Number(t.value);
        const okRange = t.value.trim() !== '' && Number.isFinite(v) && (field.minOpen ? v > field.min : v >= field.min) && v <= field.max && (!field.integer || Number.isInteger(v));
        if (!okRange) {
          ui.set({ message: { kind: 'error', text: `${LABELS[key]} must be ${field.integer ? 'a whole number ' : ''}between ${field.min} and ${field.max} ${field.unit}.` } });
          t.value = String(store.get().route[key]);
          return;
        }
        store.edit({ kind: 'set-route', key, value: v });
      },
    });
    const isDefault = route[key] === DEFAULT_ROUTE[key];
    el.append(h('div', { className: 'field' },
      h('label', { title: isDefault ? 'default' : `default ${String(DEFAULT_ROUTE[key])}` }, LABELS[key], isDefault ? '' : ' •'),
      input, h('span', { className: 'unit' }, field.unit === '-' || field.unit === 'ratio' ? '×' : field.unit)));
  }
  el.append(h('div', { className: 'row-actions' }, h('button', {
    onclick: () => { for (const k of Object.keys(DEFAULT_ROUTE) as (keyof RouteSettings)[]) store.edit({ kind: 'set-route', key: k, value: DEFAULT_ROUTE[k] }); },
  }, 'Back to defaults')));

  el.append(h('h3', {}, 'Utilities in the trench'));
  const on = store.get().utilitiesOn;
  for (const u of utilities) {
    const box = h('input', {
      type: 'checkbox', checked: on.includes(u.key), 'data-utility': u.key,
      onchange: (ev: Event) => {
        const checked = (ev.target as HTMLInputElement).checked;
        const next = utilities.map((x) => x.key).filter((k) => (k === u.key ? checked : on.includes(k)));
        store.edit({ kind: 'set-utilities-on', keys: next });
      },
    });
    el.append(h('div', { className: 'util-row', title: u.source },
      h('label', {}, box, h('span', { className: 'swatch', style: `background:${u.color}` }), `${u.label} — ${u.kind === 'main' ? 'main with tees' : 'one conduit per service'}, ${u.diameterIn} in, cover ${u.coverIn.soft}/${u.coverIn.pavement} in`)));
  }

  if (deps.autosave) renderAutosavePref(el, deps.autosave, ui);
}

function renderAutosavePref(el: HTMLElement, pref: AutosavePref, ui: UiStore): void {
  const { min, max } = AUTOSAVE_MINUTES_RANGE;
  el.append(h('h3', {}, 'Keeping unsaved work'));
  el.append(h('p', { className: 'hint' }, 'While there are unsaved edits, a recovery copy is written this often and when the app closes.'));
  const input = h('input', {
    type: 'number', 'data-pref': 'autosave-minutes', value: String(pref.minutes), min, max, step: 'any', title: `Default 3 min; allowed ${min}–${max}`,
    onchange: (ev: Event) => {
      const t = ev.target as HTMLInputElement;
      const v = Number(t.value);
      // the sheet is redrawn on a message; the input losing focus then may send "change" again
      if (v === pref.minutes) return;
      if (t.value.trim() === '' || !Number.isFinite(v) || v < min || v > max) {
        t.value = String(pref.minutes);
        ui.set({ message: { kind: 'error', text: `The autosave interval must be between ${min} and ${max} min.` } });
        return;
      }
      pref.setMinutes(v);
      ui.set({ message: { kind: 'info', text: `Unsaved edits are now kept every ${v} min.` } });
    },
  });
  el.append(h('div', { className: 'field' }, h('label', {}, 'Autosave every'), input, h('span', { className: 'unit' }, 'min')));
}
