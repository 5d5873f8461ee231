// Worker-thread entry for the fuzz tests' time and memory bounds: loads the TypeScript worker
// through tsx (each thread registers its own loader).
import { register } from 'tsx/esm/api';

register();
await import('./stageWorker.ts');
