// Turns a fast-check counterexample printed by importStages.fuzz.test.ts into a regression
// fixture: `npx tsx tests/fuzz/saveCase.ts '<counterexample JSON>' <name>` writes
// tests/fixtures/fuzz/<name>.dxf (the seed with the edits applied). Then add the file to
// CASES in regressions.test.ts with the warning or error it must give.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { applyEdits, type Edit } from './mutations';
import { seedR12, seedR2000 } from './seedDrawings';

const [json, name] = process.argv.slice(2);
if (!json || !name || !/^[a-z0-9-]+$/.test(name)) {
  process.stderr.write("usage: npx tsx tests/fuzz/saveCase.ts '[seedIndex,[edits...]]' name-in-kebab-case\n");
  process.exit(2);
}
const [which, edits] = JSON.parse(json) as [number, Edit[]];
const text = applyEdits([seedR2000(), seedR12()][which], edits);
const path = fileURLToPath(new URL(`../fixtures/fuzz/${name}.dxf`, import.meta.url));
writeFileSync(path, text, 'latin1');
process.stdout.write(`${path} (${text.length} bytes)\n`);
