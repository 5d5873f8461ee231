// Which file to open at start-up: the first command-line argument that names a drawing or project,
// else FURROW_OPEN (launch.mjs sets it to the demo site when no file is given).

const OPENABLE = /\.(dxf|furrow|json)$/i;

export function pickInitialFile(args: readonly string[], envPath: string | undefined): string | null {
  for (const a of args) {
    if (a.startsWith('-')) continue;
    if (OPENABLE.test(a)) return a;
  }
  return envPath && OPENABLE.test(envPath) ? envPath : null;
}
