/**
 * Entry of a PDF worker thread: plain JavaScript, so that it starts whether or not the parent
 * runs TypeScript through tsx; it loads the TypeScript worker through tsx's scoped loader.
 */
import { tsImport } from 'tsx/esm/api';

const worker = await tsImport('./pdf-worker.ts', import.meta.url);

export default worker.renderInWorker;
