// Entry of a calculation worker thread: registers tsx's loader (the library is TypeScript), then
// runs the worker loop of calc-worker.ts.
import { register } from 'tsx/esm/api';

register();
await import('./calc-worker.ts');
