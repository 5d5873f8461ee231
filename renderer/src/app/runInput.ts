// Turns the project state into the pipeline's input: the same files the command line reads
// (services CSV, roles JSON, settings JSON), so the app and the CLI route identically.

import type { PipelineInput } from '../../../core/pipeline';
import type { UtilitySetting } from '../../../core/settings';
import type { PointInput } from '../../../core/site/site';
import type { ProjectState } from '../state/edits';
import type { Session } from './session';

function csvField(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** services.csv text for the points, keeping only the utilities switched on. */
export function servicesCsv(points: readonly PointInput[], on: readonly string[]): { text: string; dropped: string[] } {
  const rows: string[] = ['id,x,y,role,utilities'];
  const dropped: string[] = [];
  for (const p of points) {
    const u = p.utilities.filter((k) => on.includes(k));
    if (u.length === 0) { dropped.push(p.id); continue; }
    rows.push([csvField(p.id), String(p.x), String(p.y), p.role, u.join(';')].join(','));
  }
  return { text: rows.join('\n') + '\n', dropped };
}

export function pipelineInput(session: Session, state: ProjectState, utilities: readonly UtilitySetting[], date: string): { input: PipelineInput; dropped: string[] } {
  const services = servicesCsv(state.points, state.utilitiesOn);
  const settings = {
    route: { ...state.route },
    utilities: utilities.filter((u) => state.utilitiesOn.includes(u.key)),
  };
  const base = session.name.replace(/\.[^.]*$/, '');
  return {
    dropped: services.dropped,
    input: {
      drawing: { name: session.name, bytes: new TextEncoder().encode(session.text) },
      services: { name: 'points (from the project)', text: services.text },
      roles: { name: 'layer roles (from the project)', text: JSON.stringify(state.roles) },
      settings: { name: 'route settings (from the project)', text: JSON.stringify(settings) },
      units: state.units ?? undefined,
      meta: { project: base, site: session.name, date },
    },
  };
}
