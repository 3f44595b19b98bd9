import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRequire } from 'node:module';
import { DOMParser, type Document as XmlDocument, type Element as XmlElement } from '@xmldom/xmldom';
import type { Polygon } from 'geojson';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import { formatAcres } from '../../../shared/domain/plan-checks';
import { KIND_STYLES, UNIT_KINDS, type UnitKind } from '../../../shared/domain/unit-kinds';
import { woffToSfnt } from '../../../server/services/documents/fonts';
import { escapeXml, projectionFor, renderPlanMap, renderPlanMapSvg, type PlanMapUnit } from '../../../templates/documents/kit/map-svg';
import { DocumentRenderError, FONT_FILES, moneyTable, renderPdf } from '../../../server/services/documents/pdf';
import { formatLength, planSummaryDocument } from '../../../templates/documents/plan-summary';
import { renderPlanSummaryPdf } from '../../../server/services/documents/render-documents';
import { BOUNDARY, couleeBendSummary, offset, UNITS, type FixtureUnit } from '../../support/document-fixtures';
import { ellipsoidAreaSqM, rectangleAt, WGS84 } from '../../support/geo-fixtures';

/** Metres per international foot, exact (NIST Handbook 44, App. C). */
const METRES_PER_FOOT_NIST = 0.3048;
/** Square metres per international acre, exact (NIST Handbook 44, App. C). */
const SQ_M_PER_ACRE_NIST = 4046.8564224;
/** Feet per statute mile (NIST Handbook 44, App. C). */
const FEET_PER_MILE_NIST = 5280;

/*
 * Scale tolerance. The map's projection is equirectangular with the WGS84 radii of curvature at the
 * map's centre latitude, so a bar's ground length matches the ellipsoidal distance between its two
 * ends (GeographicLib, C. Karney, "Algorithms for geodesics", J. Geodesy 87:43–55, 2013) up to
 * tan(latitude) × its north-south distance from the centre in radians: below 1e-4 for a property of
 * a mile or two, about 5e-4 for the 5-mile test below. 0.1 % holds both and still fails a
 * projection on a sphere (+0.27 % east-west at 43°N) or one that forgets cos(latitude).
 */
const SCALE_TOLERANCE = 0.001;

const PDFTOTEXT = '/usr/bin/pdftotext'; // Debian poppler-utils
const PDFFONTS = '/usr/bin/pdffonts'; // Debian poppler-utils

let workDir: string;

beforeAll(() => {
  workDir = mkdtempSync(join(tmpdir(), 'browseline-documents-'));
});
afterAll(() => {
  rmSync(workDir, { recursive: true, force: true });
});

function pdfText(pdf: Buffer, name: string, pages?: { first: number; last: number }): string {
  const file = join(workDir, `${name}.pdf`);
  writeFileSync(file, pdf);
  const range = pages ? ['-f', String(pages.first), '-l', String(pages.last)] : [];
  return execFileSync(PDFTOTEXT, [...range, '-layout', file, '-'], { encoding: 'utf8' });
}

function parseSvg(svg: string): XmlDocument {
  return new DOMParser({
    onError: (level, message) => {
      throw new Error(`SVG is not well-formed XML (${level}): ${message}`);
    },
  }).parseFromString(svg, 'image/svg+xml');
}

function elements(doc: XmlDocument, tag: string, className?: string): XmlElement[] {
  return Array.from(doc.getElementsByTagName(tag)).filter((el) => !className || el.getAttribute('class') === className);
}

/** Ground feet of a scale label: "500 ft", "1,000 ft", "1/4 mi", "2 mi". */
function labelFeet(label: string): number {
  const ft = /^([\d,]+) ft$/.exec(label);
  if (ft) return Number(ft[1].replace(/,/g, ''));
  const mi = /^(\d+)(?:\/(\d+))? mi$/.exec(label);
  if (mi) return (Number(mi[1]) / (mi[2] ? Number(mi[2]) : 1)) * FEET_PER_MILE_NIST;
  throw new Error(`unexpected scale label ${label}`);
}

/** The drawn scale bar's ends (from its segments), its label, and its ground length per GeographicLib. */
function measureDrawnScaleBar(svg: string, invert: (x: number, y: number) => [number, number]) {
  const doc = parseSvg(svg);
  const segments = elements(doc, 'rect', 'scale-segment');
  const xs = segments.map((r) => Number(r.getAttribute('x')));
  const ends = segments.map((r) => Number(r.getAttribute('x')) + Number(r.getAttribute('width')));
  const y = Number(segments[0].getAttribute('y')) + Number(segments[0].getAttribute('height')) / 2;
  const x1 = Math.min(...xs);
  const x2 = Math.max(...ends);
  const label = elements(doc, 'text', 'scale-label')[0].textContent ?? '';
  const [lon1, lat1] = invert(x1, y);
  const [lon2, lat2] = invert(x2, y);
  const geodesicM = WGS84.Inverse(lat1, lon1, lat2, lon2).s12!;
  return { segments: segments.length, x1, x2, label, geodesicM, statedM: labelFeet(label) * METRES_PER_FOOT_NIST };
}

const relDiff = (value: number, reference: number): number => value / reference - 1;

describe('plan summary PDF for an invented ~150-acre property near 43.27° N, 90.93° W', () => {
  let pdf: Buffer;
  let text: string;
  const input = couleeBendSummary();

  beforeAll(async () => {
    pdf = await renderPlanSummaryPdf(couleeBendSummary());
    text = pdfText(pdf, 'coulee-bend');
  }, 60_000);

  it('is a PDF', () => {
    // PDF header "%PDF-" (ISO 32000-1:2008, 7.5.2 File Header).
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF\s*$/);
  });

  it('the invented property is about 150 acres on the WGS84 ellipsoid', () => {
    // GeographicLib polygon area (Karney 2013) ÷ 4,046.8564224 m² per acre (NIST HB 44).
    const acres = ellipsoidAreaSqM(BOUNDARY) / SQ_M_PER_ACRE_NIST;
    expect(acres).toBeGreaterThan(140);
    expect(acres).toBeLessThan(160);
  });

  it('prints the client, the property, its acreage and every unit with its acres or length', () => {
    // Expected strings come from the input itself: the document must print what it was given.
    expect(text).toContain('Marta and Jon Lindqvist');
    expect(text).toContain('Coulee Bend');
    expect(text).toContain(formatAcres(input.property.acres)); // e.g. "150.8 acres"
    for (const unit of input.units) {
      expect(text).toContain(unit.name);
      if (unit.acres != null) expect(text).toContain(formatAcres(unit.acres));
      if (unit.lengthFt != null) expect(text).toContain(formatLength(unit.lengthFt));
    }
    // Map labels and legend are text in the PDF too, drawn from the SVG.
    expect(text).toContain('North Ridge Timber');
    expect(text).toContain('Property boundary');
  });

  it('numbers its pages "Page N of M" and keeps the Units heading with its table', () => {
    const pages = Number(/Page 1 of (\d+)/.exec(text)?.[1]);
    expect(pages).toBeGreaterThanOrEqual(1);
    expect(pages).toBeLessThanOrEqual(2); // the brief: a one-to-two page document
    for (let n = 1; n <= pages; n++) expect(text).toContain(`Page ${n} of ${pages}`);
    const page1 = pdfText(pdf, 'coulee-bend-p1', { first: 1, last: 1 });
    const headingOnly = /^\s*Units\s*$/m;
    const unitHeaderRow = /Unit\s+Kind\s+Acres, length or location/;
    // Wherever the heading falls, the table's header row is on the same page.
    expect(headingOnly.test(page1)).toBe(unitHeaderRow.test(page1));
  });

  it('boxes the cautions that the planned kinds call for', () => {
    // Cautions from PRODUCT.md "Cautions the product shows" (label is the law, harness, baiting rules).
    expect(text).toContain('Before the work begins');
    expect(text).toMatch(/follow the product label, which is the law/);
    expect(text).toMatch(/full-body harness/);
    expect(text).toMatch(/chronic wasting/);
    expect(text).toMatch(/defers to local codes, state wildlife rules and licensed practice/);
  });

  it('embeds only our fonts (Merriweather and Source Sans 3), subset', () => {
    const file = join(workDir, 'fonts.pdf');
    writeFileSync(file, pdf);
    const fonts = execFileSync(PDFFONTS, [file], { encoding: 'utf8' }).split('\n').slice(2).filter(Boolean);
    expect(fonts.length).toBeGreaterThan(0);
    for (const line of fonts) {
      expect(line).toMatch(/^[A-Z]{6}\+(Merriweather|SourceSans3)-/);
      expect(line).toMatch(/\byes\s+yes\s+yes\b/); // embedded, subset, has a ToUnicode map
    }
  });
});

describe('plan map SVG', () => {
  const mapUnits: PlanMapUnit[] = UNITS.map(({ name, kind, geometry }) => ({ name, kind, geometry }));
  const map = renderPlanMap({ boundary: BOUNDARY, units: mapUnits, widthPt: 504, heightPt: 430, title: 'Coulee Bend' });

  it('is well-formed XML using only elements that pdfmake’s svg-to-pdfkit draws', () => {
    const doc = parseSvg(map.svg);
    expect(doc.documentElement?.tagName).toBe('svg');
    const used = new Set<string>();
    const walk = (el: XmlElement) => {
      used.add(el.tagName);
      Array.from(el.childNodes).forEach((n) => n.nodeType === 1 && walk(n as XmlElement));
    };
    walk(doc.documentElement as XmlElement);
    // Elements svg-to-pdfkit draws (its SvgElem allowedChildren list); no CSS, filters or masks.
    for (const tag of used) expect(['svg', 'g', 'path', 'rect', 'circle', 'text']).toContain(tag);
    expect(map.svg).not.toMatch(/<style|paint-order|filter=|mask=|clip-path=/);
    // Dashes for the sanctuary outline and the access route, translucent fills for areas.
    expect(elements(doc, 'path').some((p) => p.getAttribute('data-kind') === 'sanctuary' && p.hasAttribute('stroke-dasharray'))).toBe(true);
    expect(map.svg).toMatch(/fill-opacity="0.55"/); // food plot, KIND_STYLES
  });

  it('draws the scale bar at the ground length its label states (GeographicLib inverse, 0.1 %)', () => {
    const bar = measureDrawnScaleBar(map.svg, map.layout.projection.invert);
    expect(bar.segments).toBe(4);
    expect(bar.label).toBe(map.layout.scaleBar.label);
    expect(Math.abs(relDiff(bar.geodesicM, bar.statedM))).toBeLessThan(SCALE_TOLERANCE);
    // A round figure that takes up a sensible share of the map's width.
    expect(['100 ft', '200 ft', '250 ft', '500 ft', '1,000 ft', '1/4 mi', '1/2 mi']).toContain(bar.label);
    expect(bar.x2 - bar.x1).toBeGreaterThan(35);
    expect(bar.x2 - bar.x1).toBeLessThanOrEqual(110.01);
  });

  it('draws a scale bar in miles for a 5-mile tract at 30° N, still within 0.1 %', () => {
    const tract = rectangleAt(30.5, -97.2, 8000, 5000); // built on WGS84 with GeographicLib
    const big = renderPlanMap({ boundary: tract, units: [], widthPt: 504, heightPt: 360 });
    const bar = measureDrawnScaleBar(big.svg, big.layout.projection.invert);
    expect(bar.label).toMatch(/mi$/);
    expect(Math.abs(relDiff(bar.geodesicM, bar.statedM))).toBeLessThan(SCALE_TOLERANCE);
  });

  it('projects with one scale on both axes that matches GeographicLib east-west and north-south', () => {
    const bbox: [number, number, number, number] = [-90.94, 43.265, -90.92, 43.275];
    const box = { xPt: 10, yPt: 20, widthPt: 400, heightPt: 300 };
    const p = projectionFor(bbox, box, 12);
    // The bbox fits inside the box less its margins, centred, touching the margins on one axis.
    const [x0, y0] = p.project(bbox[0], bbox[3]);
    const [x1, y1] = p.project(bbox[2], bbox[1]);
    expect(x0).toBeGreaterThanOrEqual(22 - 1e-9);
    expect(x1).toBeLessThanOrEqual(398 + 1e-9);
    expect(y0).toBeGreaterThanOrEqual(32 - 1e-9);
    expect(y1).toBeLessThanOrEqual(308 + 1e-9);
    expect(Math.min(Math.abs(x1 - x0 - 376), Math.abs(y1 - y0 - 276))).toBeLessThan(1e-9);
    // 100 pt east and 100 pt north of the centre, measured on the ellipsoid (GeographicLib).
    const centre = p.project(p.lon0, p.lat0);
    const [lonE, latE] = p.invert(centre[0] + 100, centre[1]);
    const [lonN, latN] = p.invert(centre[0], centre[1] - 100);
    const eastM = WGS84.Inverse(p.lat0, p.lon0, latE, lonE).s12!;
    const northM = WGS84.Inverse(p.lat0, p.lon0, latN, lonN).s12!;
    expect(Math.abs(relDiff(eastM, 100 / p.unitsPerMetre))).toBeLessThan(1e-6);
    expect(Math.abs(relDiff(northM, 100 / p.unitsPerMetre))).toBeLessThan(1e-6);
    // Round trip.
    const [lon, lat] = p.invert(...p.project(-90.931, 43.268));
    expect(lon).toBeCloseTo(-90.931, 10);
    expect(lat).toBeCloseTo(43.268, 10);
  });

  it('lists in the legend exactly the kinds present, with their labels, in palette order', () => {
    // Rule from DESIGN.md ("a legend on every map ... only kinds present" per the brief); no outside source.
    const doc = parseSvg(map.svg);
    const items = elements(doc, 'g', 'legend-item');
    const expected = UNIT_KINDS.filter((k) => mapUnits.some((u) => u.kind === k));
    expect(items.map((g) => g.getAttribute('data-kind'))).toEqual(expected);
    expect(items.map((g) => g.getElementsByTagName('text')[0].textContent)).toEqual(expected.map((k) => KIND_STYLES[k].label));
    expect(map.layout.legendKinds).toEqual(expected);
    expect(elements(doc, 'g', 'legend-boundary')).toHaveLength(1);

    const other = parseSvg(
      renderPlanMapSvg({
        units: [
          { name: 'Spring', kind: 'water-source', geometry: { type: 'Point', coordinates: offset(0, 0) } },
          { name: 'Pond', kind: 'water', geometry: squareNear(100, 100, 60) },
          { name: 'Lane gate', kind: 'gate', geometry: { type: 'Point', coordinates: offset(-150, -80) } },
        ],
        widthPt: 400,
        heightPt: 300,
      }),
    );
    expect(elements(other, 'g', 'legend-item').map((g) => g.getAttribute('data-kind'))).toEqual(['water', 'water-source', 'gate']);
    expect(elements(other, 'g', 'legend-boundary')).toHaveLength(0);
  });

  it('labels area units at their centroid when they fit, and skips those too small', () => {
    const labelled = map.layout.labels.map((l) => l.text);
    expect(labelled).toEqual(expect.arrayContaining(['North Ridge Timber', 'Hollow Sanctuary', 'Clover Plot']));
    expect(labelled).not.toContain('Ridgetop Plot'); // 0.6 acre: about 20 pt across on this map
    // Label boxes never overlap one another.
    const boxes = map.layout.labels;
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i];
        const b = boxes[j];
        const apart = Math.abs(a.xPt - b.xPt) * 2 >= a.widthPt + b.widthPt || Math.abs(a.yPt - b.yPt) * 2 >= a.heightPt + b.heightPt;
        expect(apart, `${a.text} / ${b.text}`).toBe(true);
      }
    }
  });

  it('escapes unit names for XML: Tom & Jerry’s <plot>', () => {
    const name = `Tom & Jerry's <plot>`;
    const svg = renderPlanMapSvg({
      boundary: BOUNDARY,
      units: [{ name, kind: 'food-plot', geometry: squareNear(0, 0, 220) }],
      widthPt: 504,
      heightPt: 400,
      title: `"Coulee" & <Bend>`,
    });
    expect(svg).toContain('Tom &amp; Jerry&apos;s &lt;plot&gt;');
    expect(svg).not.toContain('<plot>');
    const doc = parseSvg(svg);
    const texts = elements(doc, 'text').map((t) => t.textContent);
    expect(texts).toContain(name);
    expect(texts).toContain(`"Coulee" & <Bend>`);
    expect(escapeXml('a\u0001b')).toBe('ab'); // XML 1.0 §2.2: control characters are not allowed
  });

  it('puts Tom & Jerry’s <plot> into a PDF that reads back verbatim', async () => {
    const name = `Tom & Jerry's <plot>`;
    const extra: FixtureUnit = { name, kind: 'food-plot', geometry: squareNear(-300, 250, 150) };
    const pdf = await renderPlanSummaryPdf(couleeBendSummary([extra]));
    expect(pdfText(pdf, 'tom-and-jerry')).toContain(name);
  }, 30_000);

  it('refuses input it cannot draw, saying what to fix', () => {
    const draw = (units: PlanMapUnit[], boundary?: Polygon) => () => renderPlanMap({ boundary, units, widthPt: 504, heightPt: 400 });
    expect(draw([])).toThrow(/Nothing to draw/);
    expect(draw([{ name: 'Strip', kind: 'food-plot', geometry: { type: 'LineString', coordinates: [offset(0, 0), offset(50, 0)] } }])).toThrow(
      /"Strip": A food plot must be drawn as an area \(Polygon\)/,
    );
    const utm: Polygon = { type: 'Polygon', coordinates: [[[500000, 4790000], [500500, 4790000], [500500, 4790500], [500000, 4790000]]] };
    expect(draw([], utm)).toThrow(/not a longitude\/latitude in degrees/);
    expect(draw([{ name: 'X', kind: 'deer-pond' as UnitKind, geometry: { type: 'Point', coordinates: offset(0, 0) } }])).toThrow(/unknown kind "deer-pond"/);
    expect(() => renderPlanMap({ boundary: BOUNDARY, units: [], widthPt: 120, heightPt: 400 })).toThrow(DomainValidationError);
  });
});

describe('document engine', () => {
  it('never fetches a remote URL: remote images are refused before any request', async () => {
    // Through the images dictionary pdfmake would download; the URL policy refuses first.
    const viaDictionary = renderPdf({ images: { tile: 'https://tiles.example.com/a.png' }, content: [{ image: 'tile', width: 10 }] });
    await expect(viaDictionary).rejects.toThrow(DocumentRenderError);
    await expect(
      renderPdf({ images: { tile: 'http://127.0.0.1:9/x.png' }, content: [{ image: 'tile', width: 10 }] }),
    ).rejects.toThrow(/Access to URL denied/);
    // Inline, a URL is taken for a file name, and the local policy refuses it.
    await expect(renderPdf({ content: [{ image: 'https://tiles.example.com/a.png', width: 10 }] })).rejects.toThrow(/denied/);
  });

  it('reads no local file but its fonts', async () => {
    await expect(renderPdf({ content: [{ image: '/etc/hostname', width: 10 }] })).rejects.toThrow(/Access to local file denied/);
  });

  it('fills in the shared look and renders a small document', async () => {
    const pdf = await renderPdf({ content: [{ text: 'Season report', style: 'title' }, 'Body text 1,234.56'] });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdfText(pdf, 'small')).toContain('Body text 1,234.56');
  });

  it('prints money tables exactly from integer cents', async () => {
    const pdf = await renderPdf({
      content: [
        moneyTable([
          { label: 'Clover seed', amountCents: 123456 },
          { label: 'Flagging', amountCents: 5 },
          { label: 'Total', amountCents: 123461, total: true },
        ]),
      ],
    });
    const text = pdfText(pdf, 'money');
    // Worked by hand: 123,456 ¢ = $1,234.56; 5 ¢ = $0.05; their sum 123,461 ¢ = $1,234.61.
    expect(text).toMatch(/Clover seed\s+\$1,234\.56/);
    expect(text).toMatch(/Flagging\s+\$0\.05/);
    expect(text).toMatch(/Total\s+\$1,234\.61/);
  });

  it('reports bad plan summary input by field', () => {
    const input = couleeBendSummary();
    expect(() => planSummaryDocument({ ...input, preparedOn: 'May 4' })).toThrow(/preparedOn must be a date written YYYY-MM-DD/);
    expect(() => planSummaryDocument({ ...input, property: { ...input.property, acres: -3 } })).toThrow(/property\.acres/);
  });
});

describe('WOFF unwrapping', () => {
  const require = createRequire(import.meta.url);
  const woffPath = join(require.resolve('@fontsource/source-sans-3/package.json'), '..', 'files', 'source-sans-3-latin-400-normal.woff');

  it('gives sfnt tables whose checksums match the directory (OpenType spec, "Calculating checksums")', () => {
    const woff = readFileSync(woffPath);
    const sfnt = woffToSfnt(woff);
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4)); // flavor, 0x00010000 for TrueType
    const numTables = sfnt.readUInt16BE(4);
    expect(numTables).toBe(woff.readUInt16BE(12));
    for (let i = 0; i < numTables; i++) {
      const at = 12 + i * 16;
      const tag = sfnt.toString('latin1', at, at + 4);
      const offsetBytes = sfnt.readUInt32BE(at + 8);
      const length = sfnt.readUInt32BE(at + 12);
      if (tag === 'head') continue; // its checksum is taken with checkSumAdjustment zeroed
      let sum = 0;
      for (let b = 0; b < length; b += 4) {
        const word = sfnt.subarray(offsetBytes + b, offsetBytes + b + 4);
        sum = (sum + Buffer.concat([word, Buffer.alloc(4 - word.length)]).readUInt32BE(0)) >>> 0;
      }
      expect(sum, tag).toBe(sfnt.readUInt32BE(at + 4));
    }
  });

  it('refuses a file that is not WOFF', () => {
    expect(() => woffToSfnt(Buffer.from('not a font at all, not at all, really not a font'))).toThrow(/not a WOFF 1.0 file/);
  });

  it('the engine reads the unwrapped fonts', () => {
    for (const faces of Object.values(FONT_FILES)) {
      for (const path of Object.values(faces)) expect(readFileSync(path).length).toBeGreaterThan(10_000);
    }
  });
});

/** A square `sideM` metres across, its centre `eastM`/`northM` metres from the fixture centre. */
function squareNear(eastM: number, northM: number, sideM: number): Polygon {
  const h = sideM / 2;
  const ring = [offset(eastM - h, northM - h), offset(eastM + h, northM - h), offset(eastM + h, northM + h), offset(eastM - h, northM + h)];
  return { type: 'Polygon', coordinates: [[...ring, ring[0]]] };
}
