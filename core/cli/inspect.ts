// `furrow inspect <drawing.dxf> [--roles roles.json] [--units m|ft] [--json]`: read a drawing and
// report units, extents, layers with roles, buildings found and warnings. Exit 0 ok, 2 bad input.

import { readFile } from 'node:fs/promises';
import { registerCommand } from './main';
import { readDrawingFile } from '../io/readDrawingFile';
import { buildSite } from '../site/buildSite';
import { inspectDrawing, inspectText } from '../site/inspect';
import type { LayerRole } from '../site/site';
import { parseRolesFile } from '../site/rolesFile';
import type { LengthUnit } from '../units';

const USAGE = 'usage: furrow inspect <drawing.dxf> [--roles roles.json] [--units m|ft] [--json]';

function fail(msg: string): number {
  process.stderr.write(`furrow inspect: ${msg}\n`);
  return 2;
}

export async function inspectCommand(args: string[]): Promise<number> {
  let file: string | undefined;
  let rolesPath: string | undefined;
  let units: LengthUnit | undefined;
  let json = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--json') json = true;
    else if (a === '--roles') rolesPath = args[++i];
    else if (a === '--units') {
      const u = args[++i];
      if (u !== 'm' && u !== 'ft') return fail(`--units takes m or ft, not '${u ?? ''}'\n${USAGE}`);
      units = u;
    } else if (a.startsWith('--')) return fail(`unknown option ${a}\n${USAGE}`);
    else if (!file) file = a;
    else return fail(`one drawing at a time (got ${file} and ${a})\n${USAGE}`);
  }
  if (!file) return fail(`no drawing given\n${USAGE}`);
  if (rolesPath === undefined && args.includes('--roles')) return fail(`--roles needs a file\n${USAGE}`);

  let rolesText: string | undefined;
  if (rolesPath) {
    try {
      rolesText = await readFile(rolesPath, 'utf8');
    } catch (x) {
      return fail(`${rolesPath}: cannot read the roles file (${x instanceof Error ? x.message : String(x)})`);
    }
  }

  const d = await readDrawingFile(file);
  if (!d.ok) return fail(d.error.message);
  let roles: Record<string, LayerRole> | undefined;
  if (rolesText !== undefined && rolesPath) {
    const parsed = parseRolesFile(rolesText, rolesPath, d.value.layers.map((l) => l.name));
    if (!parsed.ok) return fail(parsed.error.message);
    roles = parsed.value.roles;
  }
  const site = buildSite(d.value, { roles, units });
  const report = inspectDrawing(d.value, site.ok ? site.value : site.error, roles);
  if (json) process.stdout.write(JSON.stringify(report, null, 2) + '\n');
  else process.stdout.write(`${file}\n${inspectText(report)}\n`);
  if (!site.ok) {
    process.stderr.write(`furrow inspect: ${file}: ${site.error.message}\n`);
    return 2;
  }
  return 0;
}

registerCommand('inspect', inspectCommand);
