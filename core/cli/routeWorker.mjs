// Worker-thread entry for `furrow route`: loads the TypeScript worker through tsx (each thread
// registers its own loader).
import { register } from 'tsx/esm/api';

register();
await import('./routeWorker.ts');
