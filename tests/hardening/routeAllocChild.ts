// Child process for routeMemory.test.ts: counts the bytes of every typed array the site router
// allocates during one route (constructors wrapped before the router is loaded), and prints one
// JSON line with the grid size and the estimate from core/limits.ts. Run: node --import tsx <this> rows cols cellM budgetMs
let allocated = 0;
for (const name of ['Float64Array', 'Float32Array', 'Int32Array', 'Uint32Array', 'Uint8Array', 'Int8Array', 'Uint16Array', 'Int16Array'] as const) {
  const Base = (globalThis as unknown as Record<string, new (...a: unknown[]) => ArrayBufferView>)[name];
  const Counted = class extends Base {
    constructor(...a: unknown[]) {
      super(...a);
      if (!(a[0] instanceof ArrayBuffer)) allocated += this.byteLength;
    }
  };
  (globalThis as unknown as Record<string, unknown>)[name] = Counted;
}
const { gridSite } = await import('./gridSite');
const { routeSiteDetailed } = await import('../../core/route/site/routeSite');
const { placeTerminals } = await import('../../core/site/placeTerminals');
const { defaultSettings } = await import('../../core/settings');
const { estimateRouteMemory } = await import('../../core/limits');
const [rows, cols, cellM, budget] = process.argv.slice(2).map(Number);
const { site, points } = gridSite(rows, cols);
const route = { ...defaultSettings().route, cellM, timeBudgetMs: budget };
const { terminals } = placeTerminals(site, points, { snapTolerance: 1 });
allocated = 0;
const d = routeSiteDetailed(site, terminals, route);
const est = estimateRouteMemory(site, route);
process.stdout.write(JSON.stringify({ rows, cols, cellM, gridNodes: d.grid.n, nx: d.grid.nx, ny: d.grid.ny, estimate: est, allocatedBytes: allocated }) + '\n');
export {};
