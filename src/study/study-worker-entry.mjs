// Entry of a study worker thread. Worker threads do not inherit the TypeScript loader a parent registered
// through tsx's API (bin/straddle.js, vitest), so register it here, then load the TypeScript task.
import { register } from 'tsx/esm/api';

register();
const { evaluateChunk } = await import('./study-worker.ts');

export default evaluateChunk;
