import { ESLint } from 'eslint';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const eslint = new ESLint({ cwd: root, overrideConfigFile: fileURLToPath(new URL('../eslint.config.js', import.meta.url)) });

async function restrictedImports(code: string, filePath: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('layer rule', () => {
  it('fails when core imports Node-only modules, Electron, pixi or the renderer', async () => {
    expect(await restrictedImports("import { readFileSync } from 'node:fs';\nexport const a = readFileSync;\n", 'core/route/x.ts')).not.toHaveLength(0);
    expect(await restrictedImports("import fs from 'fs';\nexport const a = fs;\n", 'core/site/x.ts')).not.toHaveLength(0);
    expect(await restrictedImports("import { app } from 'electron';\nexport const a = app;\n", 'core/x.ts')).not.toHaveLength(0);
    expect(await restrictedImports("import { Application } from 'pixi.js';\nexport const a = Application;\n", 'core/x.ts')).not.toHaveLength(0);
    expect(await restrictedImports("import { x } from '../../renderer/app';\nexport const a = x;\n", 'core/dxf/x.ts')).not.toHaveLength(0);
  });

  it('lets the Node edge of core (core/io, core/cli) read files', async () => {
    expect(await restrictedImports("import { readFileSync } from 'node:fs';\nexport const a = readFileSync;\n", 'core/io/x.ts')).toHaveLength(0);
  });

  it('fails when the renderer imports Electron', async () => {
    expect(await restrictedImports("import { ipcRenderer } from 'electron';\nexport const a = ipcRenderer;\n", 'renderer/x.ts')).not.toHaveLength(0);
    expect(await restrictedImports("import { x } from '../electron/main';\nexport const a = x;\n", 'renderer/x.ts')).not.toHaveLength(0);
  });
});
