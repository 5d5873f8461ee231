// Fuzzing the import stages in-process: 10 000 mutated drawings (two small seeds, one to four
// edits each) and 600 generated block structures go through readDxf → buildSite → inspectDrawing.
// Every case must end in a value (a drawing and a site, or an error value with a message) within
// a time bound, with finite coordinates throughout; nothing may throw. Fixed seed, so CI runs the
// same cases every time; the case count and the slowest case are printed as one JSON line.

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { applyEdits, editArb } from './mutations';
import { nestedBlocks, seedR12, seedR2000 } from './seedDrawings';
import { runStages } from './stages';
import { DEFAULT_MAX_BLOCK_DEPTH } from '../../core/dxf/readDxf';

const SEEDS = [seedR2000(), seedR12()];
const FUZZ_SEED = 20261202;
const MUTATED_CASES = 10_000;
/**
 * Entity limit for the in-process run: an INSERT array count mutated to 1 000 000 is a valid
 * drawing of a million entities (7 s to read); such expansions are bounded here by a lower limit
 * and run at the default limits in bombs.test.ts, one per worker with its own time bound.
 */
const FUZZ_LIMITS = { maxEntities: 100_000 };
/** Per case, in-process (a seed reads in ~1 ms; 1.5 s leaves room for a loaded 2-core CI box). */
const CASE_BOUND_MS = 1500;

describe('import stages under fuzzing', () => {
  it(`${MUTATED_CASES} mutated drawings each end in a drawing or an error value, with finite geometry, within ${CASE_BOUND_MS} ms`, () => {
    const labels = new Map<string, number>();
    let cases = 0;
    let slowest = 0;
    fc.assert(
      fc.property(fc.nat({ max: SEEDS.length - 1 }), fc.array(editArb, { minLength: 1, maxLength: 4 }), (which, edits) => {
        const text = applyEdits(SEEDS[which], edits);
        const out = runStages(text, FUZZ_LIMITS);
        cases++;
        slowest = Math.max(slowest, out.ms);
        labels.set(out.label, (labels.get(out.label) ?? 0) + 1);
        if (out.ms > CASE_BOUND_MS) throw new Error(`case took ${out.ms.toFixed(0)} ms`);
      }),
      { numRuns: MUTATED_CASES, seed: FUZZ_SEED, endOnFailure: true },
    );
    console.log(JSON.stringify({ fuzz: 'import-stages', seed: FUZZ_SEED, cases, slowestMs: Math.round(slowest), outcomes: Object.fromEntries([...labels].sort()) }));
    expect(cases).toBe(MUTATED_CASES);
    // the mix must exercise both the error paths and full site builds, or the mutations are too weak or too strong
    expect(labels.get('site') ?? 0).toBeGreaterThan(MUTATED_CASES * 0.2);
    expect([...labels.keys()].filter((k) => k.startsWith('read:')).length).toBeGreaterThanOrEqual(3);
  });

  it('block chains of any depth and cycles of any length end in the drawing or a limit that names the chain', () => {
    let cases = 0;
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.option(fc.nat({ max: 39 }), { nil: undefined }), (depth, back) => {
        const cycle = back !== undefined && back < depth ? back : -1;
        const r = runStages(nestedBlocks(depth, cycle));
        cases++;
        // expected outcome from the structure alone: a cycle is reported once the chain reaches it
        // within the depth limit; a chain deeper than the limit is refused; otherwise it reads
        if (cycle >= 0 || depth > DEFAULT_MAX_BLOCK_DEPTH) expect(r.label).toBe('read:limit');
        else expect(r.label).toBe('site');
      }),
      { numRuns: 600, seed: FUZZ_SEED },
    );
    console.log(JSON.stringify({ fuzz: 'block-structures', seed: FUZZ_SEED, cases }));
  });
});
