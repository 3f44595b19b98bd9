/**
 * Imagery a firm can turn on with one click. The USGS National Map's orthoimagery tile service is
 * public domain (USGS data are in the U.S. public domain; the USGS asks for credit), cached in Web
 * Mercator with the usual {z}/{y}/{x} tile order (ArcGIS REST "MapServer/tile"). From memory of the
 * service's documentation; the address is checked by the CSP origin test, never fetched in tests.
 */
export interface ImageryPreset {
  id: string;
  label: string;
  tileUrlTemplate: string;
  attribution: string;
}

export const PUBLIC_IMAGERY: ImageryPreset = {
  id: 'usgs-imagery',
  label: 'USGS National Map imagery (public domain)',
  tileUrlTemplate: 'https://basemap.nationalmap.gov/arcgis/rest/services/USGSImageryOnly/MapServer/tile/{z}/{y}/{x}',
  attribution: 'Imagery: U.S. Geological Survey, The National Map',
};

/** Which preset a saved template is (null for a firm's own service or none). */
export function imageryPresetOf(template: string | null | undefined): ImageryPreset | null {
  return template === PUBLIC_IMAGERY.tileUrlTemplate ? PUBLIC_IMAGERY : null;
}
