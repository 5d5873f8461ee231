// Benchmark one Steiner instance: `npx tsx tests/bench/steiner-graph.ts <instance file> [timeBudgetMs]`
// prints one JSON line {"instance","cost","lowerBound","ms"}.
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { parseStp } from '../../core/route/stp';
import { solveSteiner } from '../../core/route/steiner';

const file = process.argv[2];
if (!file) {
  console.error('usage: npx tsx tests/bench/steiner-graph.ts <instance file> [timeBudgetMs]');
  process.exit(2);
}
const parsed = parseStp(readFileSync(file, 'utf8'));
if (!parsed.ok) {
  console.error(`${file}:${parsed.error.line}: ${parsed.error.message}`);
  process.exit(1);
}
const budget = process.argv[3] ? Number(process.argv[3]) : undefined;
const t0 = performance.now();
const r = solveSteiner(parsed.value.graph, parsed.value.terminals, budget !== undefined ? { timeBudgetMs: budget } : {});
const ms = performance.now() - t0;
console.log(JSON.stringify({ instance: basename(file), cost: r.cost, lowerBound: r.lowerBound, ms: Math.round(ms * 10) / 10 }));
