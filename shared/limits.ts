/** Limits shared by the server's validation and the client's forms. */
export const LIMITS = {
  nameMax: 120,
  emailMax: 254,
  passwordMin: 10,
  passwordMax: 200,
  textMax: 4000,
  jsonBodyBytes: 2 * 1024 * 1024,
  inviteTtlHours: 72,
  verifyTtlHours: 48,
  resetTtlMinutes: 60,
} as const;

/** Geometry limits shared by the server's validation and the map editor. */
export const GEOMETRY_LIMITS = {
  /** Corners of a property boundary (a surveyed or GPS-traced outline can be long). */
  boundaryMaxVertices: 50_000,
  /** Corners of one plan unit. */
  unitMaxVertices: 10_000,
  /** Above this the self-crossing check runs in PostGIS instead of the browser and zod. */
  crossingCheckMaxVertices: 5_000,
  /** Units on one property. */
  unitsPerProperty: 2_000,
  /** Upload sizes. */
  importMaxBytes: 25 * 1024 * 1024,
  overlayMaxBytes: 40 * 1024 * 1024,
  /** Coordinate positions one imported file may hold (a plan has thousands; a county layer about a million). */
  importMaxVertices: 500_000,
  /** Bytes the entries of an uploaded zip (KMZ, zipped shapefile) may expand to, all together. */
  importMaxUnzippedBytes: 100 * 1024 * 1024,
  /** Files and folders an uploaded zip may list. */
  importMaxZipEntries: 1_000,
  /** An open GPS track whose ends lie at most this far apart (metres) may be closed into an area. */
  trackCloseMaxGapM: 30,
  /** Pixels of a GeoTIFF overlay (width × height), checked from its header before decoding. */
  overlayMaxPixels: 40_000_000,
  /** Bytes a GeoTIFF overlay's pixels may take once decoded (width × height × samples × bytes per sample). */
  overlayMaxDecodedBytes: 256 * 1024 * 1024,
  /** Longest side, in pixels, of an aerial photo printed under the plan (a 7.4 in map at about 216 dpi). */
  overlayPrintMaxSidePx: 1600,
} as const;

/** Completion photos from the field. */
export const PHOTO_LIMITS = {
  maxBytes: 15 * 1024 * 1024,
  perCompletion: 8,
  /** Pixels of one photo (width × height), read from its header before anything decodes it: a 100-megapixel phone photo passes. */
  maxPixels: 100_000_000,
  /** The longer side of a thumbnail, in pixels. */
  thumbnailPx: 480,
  /** Photos on one field observation. */
  perObservation: 8,
} as const;

/** The firm's logo: PNG or JPEG, checked by size and pixels before it is kept. */
export const LOGO_LIMITS = {
  maxBytes: 1024 * 1024,
  /** Pixels on the longer side: a letterhead prints it about 1.5 in wide, so 2000 px is plenty. */
  maxSide: 2000,
  /** Pixels on the shorter side: smaller prints blurry. */
  minSide: 32,
} as const;
