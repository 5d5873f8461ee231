// build/electron-builder.json is valid for electron-builder (checked with electron-builder's own
// schema validator from app-builder-lib, an independent source) and names the targets and icon we ship.
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { drawIcon, ICON_SIZE } from '../../build/makeIcon';

const REPO = path.resolve(__dirname, '../..');
const require = createRequire(import.meta.url);
const config = JSON.parse(fs.readFileSync(path.join(REPO, 'build', 'electron-builder.json'), 'utf8'));

describe('electron-builder configuration', () => {
  it('passes electron-builder\'s own schema validation', async () => {
    const { validateConfiguration } = require('app-builder-lib/out/util/config/config.js');
    const debug = { isEnabled: false, add: () => undefined, nestedMap: () => ({}) };
    await expect(validateConfiguration(config, debug)).resolves.toBeUndefined();
  });

  it('the validator rejects a broken configuration (the check can fail)', async () => {
    const { validateConfiguration } = require('app-builder-lib/out/util/config/config.js');
    const debug = { isEnabled: false, add: () => undefined, nestedMap: () => ({}) };
    await expect(validateConfiguration({ ...config, linux: { target: 42 }, notAnOption: true }, debug)).rejects.toThrow();
  });

  it('targets AppImage and deb on Linux, NSIS on Windows and DMG on macOS', () => {
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.win.target).toEqual(['nsis']);
    expect(config.mac.target).toEqual(['dmg']);
  });

  it('packs the bundled main process named in package.json and the built renderer', () => {
    const pkg = JSON.parse(fs.readFileSync(path.join(REPO, 'package.json'), 'utf8'));
    expect(config.extraMetadata.main).toBe(pkg.main);
    expect(config.files).toContain('electron/dist/**');
    expect(config.files).toContain('renderer/dist/**');
  });

  it('uses a committed 512×512 icon identical to what build/makeIcon.ts draws', () => {
    for (const key of ['linux', 'win', 'mac']) expect(config[key].icon).toBe('build/icon.png');
    const committed = PNG.sync.read(fs.readFileSync(path.join(REPO, 'build', 'icon.png')));
    expect([committed.width, committed.height]).toEqual([ICON_SIZE, ICON_SIZE]);
    expect(Buffer.compare(committed.data, drawIcon().data)).toBe(0);
  });
});
