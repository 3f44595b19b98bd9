/** Import entry point: detect the format by content, cross-check the extension, read and normalise. */
import { unreadableFile, unsupportedFile } from './geo-file-error';
import { extensionClaim, extensionFits, fileExtension, formatLabel, sniffContent, type ExtensionClaim } from './detect-format';
import { normalizeFeatures, PROJECTED_REASON, type NormalizeOptions, type SourceFeature } from './normalize-features';
import { readGeoJsonText } from './read-geojson';
import { readGpxText, readKmlText, xmlRootOf } from './read-xml';
import { describeForeignZip, openZip, readKmz, readShapefileZip, zipContentKind } from './read-zip';
import type { GeoFileInput, GeoFileReadResult, ImportedFeature, ImportFormat, ReadGeoFileOptions } from './types';
import { GEOMETRY_LIMITS } from '../../../shared/limits';
import { closableTrackGapM } from '../../../shared/domain/track-closing';

/** Most features (found plus skipped) one import may hold; a plan has dozens, a county layer thousands. */
export const DEFAULT_MAX_FEATURES = 50_000;
/** Most bytes the entries of one archive may expand to together (a guard against zip bombs). */
export const DEFAULT_MAX_UNZIPPED_BYTES = GEOMETRY_LIMITS.importMaxUnzippedBytes;
/** Most coordinate positions one import may hold. */
export const DEFAULT_MAX_VERTICES = GEOMETRY_LIMITS.importMaxVertices;
/** Most entries one archive may list. */
export const DEFAULT_MAX_ZIP_ENTRIES = GEOMETRY_LIMITS.importMaxZipEntries;

const SUPPORTED = 'Browseline reads GeoJSON (.geojson, .json), KML (.kml), KMZ (.kmz), GPX (.gpx) and zipped shapefiles (.zip).';

const CLAIM_LABELS: Record<Exclude<ExtensionClaim, null>, string> = {
  geojson: 'a GeoJSON file',
  json: 'a JSON file',
  kml: 'a KML',
  kmz: 'a KMZ',
  gpx: 'a GPX file',
  shapefile: 'a zipped shapefile',
  zip: 'a zip archive',
  xml: 'an XML file',
  shp: 'a shapefile',
};

function mismatchWarning(filename: string, claim: ExtensionClaim, format: ImportFormat): string[] {
  if (extensionFits(claim, format)) return [];
  const ext = fileExtension(filename);
  return [
    ext
      ? `The file is named ".${ext}" but holds ${CLAIM_LABELS[format]}; it was read as ${formatLabel(format)}.`
      : `The file name has no extension; the content was read as ${formatLabel(format)}.`,
  ];
}

function unsupportedMessage(filename: string, claim: ExtensionClaim, looksLike?: string): string {
  const ext = fileExtension(filename);
  if (claim === 'shp' || looksLike === 'a bare shapefile main file (.shp)') {
    return 'A shapefile needs its companion files: put the .shp together with its .shx, .dbf and .prj files in one .zip and upload the zip.';
  }
  const seems = looksLike ? `; its content looks like ${looksLike}` : '';
  if (claim) {
    const expected = claim === 'shapefile' ? 'a zipped shapefile' : CLAIM_LABELS[claim];
    return `"${filename}" is named like ${expected} but is not one${seems}. ${SUPPORTED}`;
  }
  return `Files of this type${ext ? ` (.${ext})` : ''} cannot be imported${seems}. ${SUPPORTED}`;
}

/**
 * Read an uploaded geometry file (GeoJSON, KML, KMZ, GPX or zipped shapefile) into plan-ready
 * lon/lat features plus the features skipped with their reasons; throws GeoFileError (415/422/413).
 */
export async function readGeoFile(input: GeoFileInput, options: ReadGeoFileOptions = {}): Promise<GeoFileReadResult> {
  const maxFeatures = options.maxFeatures ?? DEFAULT_MAX_FEATURES;
  const maxUnzippedBytes = options.maxUnzippedBytes ?? DEFAULT_MAX_UNZIPPED_BYTES;
  const limits = { maxFeatures, maxVertices: options.maxVertices ?? DEFAULT_MAX_VERTICES };
  const zipLimits = { maxUnzippedBytes, maxEntries: options.maxZipEntries ?? DEFAULT_MAX_ZIP_ENTRIES };
  const filename = input.filename || 'upload';
  const bytes = input.buffer instanceof Uint8Array ? input.buffer : new Uint8Array(input.buffer);
  const claim = extensionClaim(filename);
  if (bytes.length === 0) throw unreadableFile(`"${filename}" is empty (0 bytes). Export the file again and upload it.`);

  const sniffed = sniffContent(bytes);
  const normalizeOptions: NormalizeOptions = { maxFeatures };
  let format: ImportFormat;
  let sources: SourceFeature[];
  let warnings: string[] = [];

  switch (sniffed.kind) {
    case 'zip': {
      const claimed = claim === 'kmz' ? 'named .kmz' : claim === 'zip' ? '' : claim ? `named .${fileExtension(filename)}` : '';
      const opened = await openZip(bytes, claimed, zipLimits);
      const kind = zipContentKind(opened.entries);
      if (!kind) throw unsupportedFile(describeForeignZip(opened.entries));
      format = kind;
      if (kind === 'kmz') {
        const kmz = await readKmz(opened, limits);
        sources = kmz.sources;
        warnings = kmz.warnings;
        normalizeOptions.noGeometryReason = 'the placemark has no geometry, or its coordinates could not be read';
      } else {
        const shapefile = await readShapefileZip(opened, limits);
        sources = shapefile.sources;
        warnings = shapefile.warnings;
        normalizeOptions.noGeometryReason = 'the record has a null shape';
        normalizeOptions.projectedReason = shapefile.missingPrj
          ? 'coordinates look projected (metres?) and the zip has no .prj file saying how — include the .prj, or export as WGS84 longitude/latitude'
          : `${PROJECTED_REASON} (the .prj's coordinate system could not be applied)`;
        if (shapefile.nad27) {
          normalizeOptions.notesForAll = [
            'the .prj names NAD27; its datum shift to WGS84 was not applied, so positions may be off by tens of metres — export in WGS84 or NAD83 for exact positions',
          ];
        }
      }
      break;
    }
    case 'xml': {
      const root = sniffed.root;
      if (root && root !== 'kml' && root !== 'gpx') {
        throw unsupportedFile(`This XML file's root element is <${root}>; only KML (<kml>) and GPX (<gpx>) XML can be imported. ${SUPPORTED}`);
      }
      // Name the format in parse errors: the root element if it could be seen, else the extension.
      const label = root === 'kml' || root === 'gpx' ? formatLabel(root) : claim === 'kml' || claim === 'gpx' ? formatLabel(claim) : 'XML file';
      const parsedRoot = root ?? xmlRootOf(sniffed.text);
      if (parsedRoot === 'kml') {
        format = 'kml';
        const kml = readKmlText(sniffed.text, limits, undefined, label);
        sources = kml.sources;
        if (kml.links.length > 0 && sources.length === 0) {
          warnings = [`This KML only links to other files (${kml.links.slice(0, 3).join(', ')}); links are followed inside a KMZ only. Upload the KMZ, or the linked files.`];
        }
        normalizeOptions.noGeometryReason = 'the placemark has no geometry, or its coordinates could not be read';
      } else if (parsedRoot === 'gpx') {
        format = 'gpx';
        sources = readGpxText(sniffed.text, limits);
        normalizeOptions.noGeometryReason = 'no usable points (a route or track needs at least 2)';
      } else if (parsedRoot === null) {
        readKmlText(sniffed.text, limits, undefined, label); // names the XML problem and its line
        throw unreadableFile(`This ${label} has no root element. Export it again.`);
      } else {
        throw unsupportedFile(`This XML file's root element is <${parsedRoot}>; only KML (<kml>) and GPX (<gpx>) XML can be imported. ${SUPPORTED}`);
      }
      break;
    }
    case 'json': {
      format = 'geojson';
      const read = readGeoJsonText(sniffed.text, limits);
      sources = read.sources;
      warnings = read.warnings;
      normalizeOptions.noGeometryReason = 'the feature has a null geometry';
      break;
    }
    default:
      throw unsupportedFile(unsupportedMessage(filename, claim, sniffed.looksLike), { looksLike: sniffed.looksLike });
  }

  const { features, skipped } = normalizeFeatures(sources, normalizeOptions);
  for (const feature of features) markClosable(feature);
  return { format, features, skipped, warnings: [...mismatchWarning(filename, claim, format), ...warnings] };
}

/** An open line whose ends lie within the stated distance may become an area: say so on the feature. */
function markClosable(feature: ImportedFeature): void {
  if (feature.family !== 'line') return;
  const gap = closableTrackGapM(feature.geometry, GEOMETRY_LIMITS.trackCloseMaxGapM);
  if (gap === null) return;
  feature.closableGapM = Math.round(gap * 10) / 10;
  feature.notes.push(
    `its ends are ${gap < 1 ? 'less than 1' : Math.round(gap)} m apart (at most ${GEOMETRY_LIMITS.trackCloseMaxGapM} m): it can be the property boundary or an area, closed by joining its ends`,
  );
}
