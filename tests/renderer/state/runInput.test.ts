// The app hands the pipeline the same files the command line reads; core's own parsers accept them.
import { describe, expect, it } from 'vitest';
import { parsePointsCsv } from '../../../core/site/pointsCsv';
import { parseSettingsFile } from '../../../core/settingsFile';
import { parseRolesFile } from '../../../core/site/rolesFile';
import { DEFAULT_ROUTE, defaultSettings } from '../../../core/settings';
import { servicesCsv, pipelineInput } from '../../../renderer/src/app/runInput';
import type { Session } from '../../../renderer/src/app/session';

describe('run input from the project', () => {
  it('writes a services CSV core reads back, keeping only utilities that are on', () => {
    const pts = [
      { id: 'POC,1', x: 1.5, y: 2.25, role: 'connection' as const, utilities: ['power', 'gas'] },
      { id: 'S1', x: 3, y: 4, role: 'service' as const, utilities: ['gas'] },
      { id: 'S2', x: 5, y: 6, role: 'service' as const, utilities: ['power', 'telecom'] },
    ];
    const { text, dropped } = servicesCsv(pts, ['power']);
    expect(dropped).toEqual(['S1']);
    const back = parsePointsCsv(text, ['power', 'telecom', 'water', 'gas']);
    expect(back.ok && back.value).toEqual([
      { id: 'POC,1', x: 1.5, y: 2.25, role: 'connection', utilities: ['power'] },
      { id: 'S2', x: 5, y: 6, role: 'service', utilities: ['power'] },
    ]);
  });

  it('gives settings and roles core accepts', () => {
    const utilities = defaultSettings().utilities;
    const session = { name: 'site.dxf', text: '0\nEOF\n' } as Session;
    const { input } = pipelineInput(session, {
      roles: { BLDG: 'building' }, points: [], route: { ...DEFAULT_ROUTE, cellM: 0.25 }, utilitiesOn: ['power', 'water'], units: 'm',
    }, utilities, '2026-01-01');
    const s = parseSettingsFile(input.settings!.text);
    expect(s.ok).toBe(true);
    if (s.ok) {
      expect(s.value.route.cellM).toBe(0.25);
      expect(s.value.utilities.map((u) => u.key)).toEqual(['power', 'water']);
    }
    expect(parseRolesFile(input.roles!.text).ok).toBe(true);
    expect(new TextDecoder().decode(input.drawing.bytes)).toBe('0\nEOF\n');
    expect(input.units).toBe('m');
  });
});
