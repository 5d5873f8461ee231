// File edge of `furrow route`: read the inputs into a PipelineInput, write the outputs and
// summary.json into the output folder. Errors name the file and what to do.

import { mkdir, readFile, stat, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { DEFAULT_MAX_BYTES } from '../dxf/readDxf';
import type { PipelineInput, Summary } from '../pipeline';
import { OUTPUT_FILES } from '../pipeline';
import { err, ok, type Result } from '../result';
import type { LengthUnit } from '../units';

export interface RouteArgs {
  drawing: string;
  services: string;
  roles?: string;
  settings?: string;
  units?: LengthUnit;
  out: string;
}

export interface FileError { file: string; message: string }

async function readText(path: string, what: string): Promise<Result<string, FileError>> {
  try {
    const st = await stat(path);
    if (!st.isFile()) return err({ file: path, message: `${path}: not a file; give the path of the ${what}` });
    return ok(await readFile(path, 'utf8'));
  } catch {
    return err({ file: path, message: `${path}: no such file; check the path of the ${what}` });
  }
}

/** Read every input named on the command line. `date` goes into the schedules' title block. */
export async function readRouteInputs(a: RouteArgs, date: string): Promise<Result<PipelineInput, FileError>> {
  let bytes: Uint8Array;
  try {
    const st = await stat(a.drawing);
    if (!st.isFile()) return err({ file: a.drawing, message: `${a.drawing}: not a file; give the path of a .dxf drawing` });
    if (st.size > DEFAULT_MAX_BYTES) return err({ file: a.drawing, message: `${a.drawing}: the file is over ${DEFAULT_MAX_BYTES / 1048576} MB; purge unused layers and blocks first` });
    bytes = new Uint8Array(await readFile(a.drawing));
  } catch {
    return err({ file: a.drawing, message: `${a.drawing}: no such file; check the path of the drawing` });
  }
  const services = await readText(a.services, 'services CSV (id,x,y,role,utilities)');
  if (!services.ok) return services;
  const input: PipelineInput = {
    drawing: { name: basename(a.drawing), bytes },
    services: { name: basename(a.services), text: services.value },
    units: a.units,
    meta: { project: 'Furrow trench route', site: basename(a.drawing).replace(/\.dxf$/i, ''), date },
  };
  if (a.roles) {
    const r = await readText(a.roles, 'roles JSON');
    if (!r.ok) return r;
    input.roles = { name: basename(a.roles), text: r.value };
  }
  if (a.settings) {
    const s = await readText(a.settings, 'settings JSON');
    if (!s.ok) return s;
    input.settings = { name: basename(a.settings), text: s.value };
  }
  return ok(input);
}

/** Write the output set and summary.json into `out` (created when missing). */
export async function writeRouteOutputs(
  out: string,
  files: Record<keyof typeof OUTPUT_FILES, Uint8Array | string>,
  summary: Summary,
): Promise<Result<string[], FileError>> {
  try {
    await mkdir(out, { recursive: true });
    const written: string[] = [];
    for (const key of Object.keys(OUTPUT_FILES) as (keyof typeof OUTPUT_FILES)[]) {
      const p = join(out, summary.files[key]);
      await writeFile(p, files[key]);
      written.push(p);
    }
    const sp = join(out, 'summary.json');
    await writeFile(sp, JSON.stringify(summary, null, 2) + '\n');
    written.push(sp);
    return ok(written);
  } catch (x) {
    return err({ file: out, message: `${out}: cannot write the output (${x instanceof Error ? x.message : String(x)}); choose a folder you can write to with --out` });
  }
}
