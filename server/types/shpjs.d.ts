/** Types for shpjs 6 (it ships none): the parts of its API that Browseline uses. */
declare module 'shpjs' {
  import type { FeatureCollection, Geometry } from 'geojson';

  type BinaryInput = ArrayBuffer | ArrayBufferView | DataView;

  /** A shapefile's member files; `prj` and `cpg` may be text. */
  export interface ShapefileParts {
    shp: BinaryInput;
    dbf?: BinaryInput;
    prj?: string | BinaryInput;
    cpg?: string | BinaryInput;
  }

  /** One layer as GeoJSON in WGS84 lon/lat; `fileName` is the layer name for zipped input. */
  export type ShapefileCollection = FeatureCollection<Geometry | null, Record<string, unknown>> & { fileName?: string };

  /** Read a shapefile from a URL, a zip buffer or its member files; a zip with several layers gives an array. */
  export default function getShapefile(
    input: string | BinaryInput | ShapefileParts,
    whiteList?: string[],
  ): Promise<ShapefileCollection | ShapefileCollection[]>;

  /** Read every layer of a zipped shapefile. */
  export function parseZip(buffer: BinaryInput, whiteList?: string[]): Promise<ShapefileCollection | ShapefileCollection[]>;
  /** Read the geometries of a .shp, reprojecting with the .prj text when given. */
  export function parseShp(shp: BinaryInput, prj?: string | BinaryInput): Array<Geometry | null>;
  /** Read the records of a .dbf, decoding text with the .cpg code page when given. */
  export function parseDbf(dbf: BinaryInput, cpg?: string | BinaryInput): Array<Record<string, unknown>>;
  /** Join geometries and records into a FeatureCollection. */
  export function combine(parts: [Array<Geometry | null>, Array<Record<string, unknown>>?]): ShapefileCollection;
}
