/** Entry of a wind-file worker thread: plain JavaScript that loads the TypeScript worker through tsx's scoped loader. */
import { tsImport } from 'tsx/esm/api';

await tsImport('./wind-file-worker.ts', import.meta.url);
