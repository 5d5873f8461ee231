import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const run = promisify(execFile);
const bin = fileURLToPath(new URL('../../core/cli/furrow.mjs', import.meta.url));

describe('furrow --help', () => {
  it('lists every command and the notice', async () => {
    const { stdout } = await run(process.execPath, [bin, '--help']);
    for (const cmd of ['inspect', 'route', 'help']) expect(stdout).toMatch(new RegExp(`^  ${cmd}\\b`, 'm'));
    expect(stdout).toMatch(/811/);
  });

  it('rejects an unknown command with exit code 2', async () => {
    await expect(run(process.execPath, [bin, 'frobnicate'])).rejects.toMatchObject({ code: 2 });
  });
});
