/** Wires MapLibre's worker to our own bundled file for the observation map (the CSP allows only our origin and blob: workers). */
import { setWorkerUrl } from 'maplibre-gl';
import workerUrl from 'maplibre-gl/dist/maplibre-gl-worker.mjs?url';
import 'maplibre-gl/dist/maplibre-gl.css';

setWorkerUrl(workerUrl);
