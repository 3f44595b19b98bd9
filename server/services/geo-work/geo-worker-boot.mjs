// Worker-thread entry of the geo pool: registers tsx (so the TypeScript modules load in the worker,
// also under the test runner) and hands piscina the task functions.
import { register } from 'tsx/esm/api';

register();
const tasks = await import('./geo-worker.ts');

export const importGeoFile = tasks.importGeoFile;
export const prepareOverlayImage = tasks.prepareOverlayImage;
export default tasks.importGeoFile;
