// `furrow` command line: the same pipeline as the app, without a window.
import { noticeText } from '../notice';

export const COMMANDS: { name: string; usage: string; summary: string }[] = [
  { name: 'inspect', usage: 'furrow inspect <drawing.dxf> [--roles roles.json] [--units m|ft] [--json]', summary: 'read a drawing: units, extents, layers with roles, buildings found, warnings' },
  { name: 'route', usage: 'furrow route <drawing.dxf> --services <services.csv> [--roles roles.json] [--settings settings.json] [--units m|ft] --out <dir> [--json]', summary: 'route the shared trench and write the DXF layers, take-off schedules and summary.json' },

  { name: 'help', usage: 'furrow help', summary: 'this text' },
];

export function helpText(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  return [
    'furrow — lay out and price the shared underground utility trench on a DXF site plan',
    '',
    'Commands:',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    '',
    'Usage:',
    ...COMMANDS.map((c) => `  ${c.usage}`),
    '',
    'Exit codes: 0 done; 2 bad input; 3 done in part (some points unreachable); 130 cancelled (Ctrl-C).',
    'Progress goes to stderr as a bar on a terminal; set FURROW_PROGRESS=lines for one line per stage.',
    '',
    noticeText('\n'),
  ].join('\n');
}

type Handler = (args: string[]) => Promise<number>;
const handlers: Record<string, Handler> = {};

/** Later stages register their commands here (kept in one table so help lists them all). */
export function registerCommand(name: string, handler: Handler): void {
  handlers[name] = handler;
}

export async function main(argv: string[]): Promise<number> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === 'help' || cmd === '--help' || cmd === '-h') {
    process.stdout.write(helpText() + '\n');
    return 0;
  }
  await import('./commands');
  const h = handlers[cmd];
  if (!h) {
    process.stderr.write(`furrow: unknown command '${cmd}'. Run 'furrow --help' for the list.\n`);
    return 2;
  }
  return h(rest);
}
