// The bridge contract: every argument crossing into main is validated.
import { describe, expect, it } from 'vitest';
import {
  CHANNELS, MENU_COMMANDS, hasAllowedExtension, isMenuCommand, validateDocumentState, validateOpenKind,
  validatePath, validateWriteRequest,
} from '../../electron/contract';

describe('bridge contract validators', () => {
  it('accepts only the three openable kinds', () => {
    expect(validateOpenKind('drawing').ok).toBe(true);
    expect(validateOpenKind('project').ok).toBe(true);
    expect(validateOpenKind('points').ok).toBe(true);
    for (const bad of ['pdf', '', null, 3, { kind: 'drawing' }, '__proto__']) expect(validateOpenKind(bad).ok).toBe(false);
  });

  it('rejects write requests with folders in the name, unknown kinds or non-data payloads', () => {
    expect(validateWriteRequest({ kind: 'dxf', suggestedName: 'trench.dxf', data: '0\nEOF\n' }).ok).toBe(true);
    expect(validateWriteRequest({ kind: 'xlsx', suggestedName: 'takeoff.xlsx', data: new Uint8Array([80, 75]) }).ok).toBe(true);
    const bad = [
      null, 'x', { kind: 'exe', suggestedName: 'a.exe', data: '' },
      { kind: 'dxf', suggestedName: '../../etc/passwd', data: '' },
      { kind: 'dxf', suggestedName: 'C:\\Windows\\x.dxf', data: '' },
      { kind: 'dxf', suggestedName: '', data: '' },
      { kind: 'dxf', suggestedName: 'a.dxf', data: 42 },
      { kind: 'dxf', suggestedName: 'a.dxf', data: { length: 3 } },
    ];
    for (const b of bad) expect(validateWriteRequest(b).ok, JSON.stringify(b)).toBe(false);
  });

  it('rejects empty, overlong and NUL-containing paths', () => {
    expect(validatePath('/home/u/site.dxf').ok).toBe(true);
    expect(validatePath('').ok).toBe(false);
    expect(validatePath('a\0b').ok).toBe(false);
    expect(validatePath('x'.repeat(5000)).ok).toBe(false);
    expect(validatePath(['a']).ok).toBe(false);
  });

  it('checks document state types', () => {
    expect(validateDocumentState('site.dxf', true).ok).toBe(true);
    expect(validateDocumentState('site.dxf', 'yes').ok).toBe(false);
    expect(validateDocumentState(7, false).ok).toBe(false);
  });

  it('knows menu commands and extensions', () => {
    for (const c of MENU_COMMANDS) expect(isMenuCommand(c)).toBe(true);
    expect(isMenuCommand('rm -rf')).toBe(false);
    expect(hasAllowedExtension('Site.DXF', 'drawing')).toBe(true);
    expect(hasAllowedExtension('site.dwg', 'drawing')).toBe(false);
    expect(hasAllowedExtension('job.furrow', 'project')).toBe(true);
    expect(hasAllowedExtension('noext', 'csv')).toBe(false);
  });

  it('uses one distinct channel name per bridge function', () => {
    const names = Object.values(CHANNELS);
    expect(new Set(names).size).toBe(names.length);
    for (const n of names) expect(n).toMatch(/^furrow:[a-z-]+$/);
  });
});
