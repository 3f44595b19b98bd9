/**
 * The portal's demo: Kettle Hollow's family may upload files, two documents shared with them (a soil
 * test report and a season map, both PDFs made here with pdfmake). The farm's tasks and the crew's
 * photo come from the schedule seed (demo-schedule.ts). Idempotent: finds before it creates. All values are invented demo data.
 */
import zlib from 'node:zlib';
import { Client, Property, SharedFile, User, type Firm } from '../../models';
import { saveFile } from '../../services/storage/storage';
import { renderPdf, pageFrame, keyValueTable } from '../../services/documents/pdf';

const FAMILY = 'Okonkwo-Larsen Family';
const FARM = 'Kettle Hollow Farm';

/** A small soil-test report (invented lab values for the demo). */
async function soilTestPdf(firmName: string): Promise<Buffer> {
  return renderPdf({
    ...pageFrame({ title: 'Soil test report', firmName, preparedOn: 'April 14, 2026' }),
    content: [
      { text: 'Soil test — Ridge clover plot', style: 'title' },
      { text: 'Kettle Hollow Farm · sampled April 2, 2026 · 12 cores, 0–6 in', margin: [0, 0, 0, 12] },
      keyValueTable([
        { label: 'Soil pH', value: '5.8' },
        { label: 'Phosphorus (Bray P1)', value: '18 ppm' },
        { label: 'Potassium', value: '110 ppm' },
        { label: 'Organic matter', value: '3.2 %' },
        { label: 'Lime to reach pH 6.5', value: '2.0 tons per acre' },
      ]),
      { text: 'Demo document: the values are invented for the Browseline demo.', margin: [0, 16, 0, 0], italics: true },
    ],
  });
}

/** A one-page season note with the plan's headline (invented). */
async function seasonMapPdf(firmName: string): Promise<Buffer> {
  return renderPdf({
    ...pageFrame({ title: 'Season plan', firmName, preparedOn: 'March 3, 2026' }),
    content: [
      { text: 'Kettle Hollow Farm — the 2026 season', style: 'title' },
      { text: 'Spring: lime and seed the ridge clover plot. Summer: brassicas in the hollow plot. Late winter: hinge-cut the south slope bedding.' },
    ],
  });
}

/** A 240 × 160 PNG of a green field under a pale sky, standing in for a crew photo. */
export function demoPhotoPng(): Buffer {
  const w = 240;
  const h = 160;
  const raw = Buffer.alloc((w * 3 + 1) * h);
  for (let y = 0; y < h; y++) {
    const row = y * (w * 3 + 1);
    raw[row] = 0;
    for (let x = 0; x < w; x++) {
      const i = row + 1 + x * 3;
      const ground = y > 60 + Math.round(8 * Math.sin(x / 30));
      const [r, g, b] = ground ? [90 + ((x * 7 + y * 3) % 40), 140 + ((x * 5) % 30), 60] : [200, 222, 236];
      raw[i] = r;
      raw[i + 1] = g;
      raw[i + 2] = b;
    }
  }
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const byte of buf) c = crcTable[(c ^ byte) & 0xff] ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const sum = Buffer.alloc(4);
    sum.writeUInt32BE(crc(body));
    return Buffer.concat([len, body, sum]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(w, 0);
  ihdr.writeUInt32BE(h, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour RGB
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', zlib.deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]);
}

/** Creates whatever part of the portal demo is missing. */
export async function seedDemoPortal(firm: Firm): Promise<void> {
  const client = await Client.findOne({ where: { firmId: firm.id, name: FAMILY } });
  const farm = client ? await Property.findOne({ where: { firmId: firm.id, clientId: client.id, name: FARM } }) : null;
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  if (!client || !farm) return;

  // Keyed on the demo's own file, not on any file: an upload made before the first seed must not stop it.
  if ((await SharedFile.count({ where: { clientId: client.id, title: 'Season plan 2026' } })) === 0) {
    const files = [
      { title: 'Soil test — Ridge clover plot (April 2026)', category: 'soil-test' as const, bytes: await soilTestPdf(firm.name), propertyId: farm.id },
      { title: 'Season plan 2026', category: 'season-report' as const, bytes: await seasonMapPdf(firm.name), propertyId: farm.id },
    ];
    for (const f of files) {
      const key = await saveFile('files', f.bytes, 'pdf');
      await SharedFile.create({ firmId: firm.id, clientId: client.id, propertyId: f.propertyId, category: f.category, title: f.title, storageKey: key, originalName: `${f.category}.pdf`, contentType: 'application/pdf', byteSize: f.bytes.length, visibleToClient: true, uploadedById: consultant?.id ?? null, uploadedByRole: 'staff' });
    }
    await client.update({ portalUploadsAllowed: true });
  }
  // The farm's tasks and the crew's photo come from the schedule seed (demo-schedule.ts).
}
