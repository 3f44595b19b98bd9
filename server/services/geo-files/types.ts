/** Shapes shared by the geometry-file readers and writers. */
import type { LineString, MultiLineString, MultiPolygon, Point, Polygon } from 'geojson';
import type { KindFamily, UnitKind } from '../../../shared/domain/unit-kinds';

export type ImportFormat = 'geojson' | 'kml' | 'kmz' | 'gpx' | 'shapefile';
export type ExportFormat = 'geojson' | 'kml' | 'gpx' | 'csv';
export type PlanGeometry = Polygon | MultiPolygon | LineString | MultiLineString | Point;
export type AreaGeometry = Polygon | MultiPolygon;

export interface GeoFileInput {
  filename: string;
  buffer: Buffer | Uint8Array;
}

export interface ReadGeoFileOptions {
  /** Guard on the number of features (found plus skipped); defaults to DEFAULT_MAX_FEATURES. */
  maxFeatures?: number;
  /** Guard on the bytes the entries of an archive may expand to together; defaults to DEFAULT_MAX_UNZIPPED_BYTES. */
  maxUnzippedBytes?: number;
  /** Guard on the coordinate positions of the whole file; defaults to DEFAULT_MAX_VERTICES. */
  maxVertices?: number;
  /** Guard on the entries an archive may list; defaults to DEFAULT_MAX_ZIP_ENTRIES. */
  maxZipEntries?: number;
}

export interface ImportedFeature {
  /** Position of the source feature in the file (0-based, in the order the file was read). */
  index: number;
  /** Set when one source feature gave several features (a mixed GeometryCollection, a MultiPoint). */
  part?: number;
  name: string;
  geometry: PlanGeometry;
  family: KindFamily;
  /** The unit kind the file states (a `kind` property, KML ExtendedData, GPX <type>), when it fits the family. */
  kind?: UnitKind;
  properties: Record<string, unknown>;
  /** What the importer changed or noticed (ring closed, elevations dropped, …). */
  notes: string[];
  /** Set on an open line (a walked GPS track) whose ends lie close enough to close it into an area: the gap in metres. */
  closableGapM?: number;
}

export interface SkippedFeature {
  index: number;
  part?: number;
  name?: string;
  reason: string;
}

export interface GeoFileReadResult {
  format: ImportFormat;
  features: ImportedFeature[];
  skipped: SkippedFeature[];
  /** File-level remarks, e.g. an extension that does not match the content. */
  warnings: string[];
}

export interface ExportUnit {
  id: string | number;
  name: string;
  kind: UnitKind;
  geometry: PlanGeometry;
  acres?: number | null;
  lengthFt?: number | null;
  notes?: string | null;
}

/** A field observation in an export: a point with its kind and time. */
export interface ExportObservation {
  id: number;
  kind: string;
  /** The kind's label ("Scrape"). */
  label: string;
  /** ISO instant. */
  observedAt: string;
  position: [number, number];
  unitName?: string | null;
  notes?: string | null;
}

export interface PlanExport {
  propertyName: string;
  boundary?: AreaGeometry | null;
  units: ExportUnit[];
  /** Field observations, written after the units (family "observation"). */
  observations?: ExportObservation[];
}

export interface GeoFileOutput {
  contentType: string;
  filename: string;
  body: string | Buffer;
}
