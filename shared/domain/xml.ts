/** XML text escaping shared by the GeoJSON/KML/GPX writers and the documents' SVG. Pure. */

// Characters XML 1.0 does not allow at all (most C0 controls, lone surrogates, U+FFFE/U+FFFF).
// eslint-disable-next-line no-control-regex -- the point is to list the allowed control characters
const XML_INVALID = /[^\u0009\u000A\u000D\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu;

/** Text made safe for XML element content and attribute values. */
export function escapeXml(text: string): string {
  return text
    .replace(XML_INVALID, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}
