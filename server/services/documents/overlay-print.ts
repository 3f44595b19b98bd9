/**
 * Aerial photos printed under the plan: the overlays a consultant marked "print under the plan"
 * (`inDocuments`), downscaled for print with sharp (libvips works on the libuv thread pool, so the
 * event loop stays free) and handed to the map SVG as data URLs with their corners.
 */
import sharp from 'sharp';
import type { Transaction } from 'sequelize';
import { Overlay } from '../../models';
import { readFile, saveFile } from '../storage/storage';
import { GEOMETRY_LIMITS } from '../../../shared/limits';
import type { PlanSnapshot } from '../../../shared/domain/proposal-totals';
import type { PlanMapOverlay } from '../../../templates/documents/kit/map-svg';
import { logger } from '../../logger';

type PrintImage = { bytes: Buffer; kind: 'png' | 'jpeg' };
type FrozenOverlay = NonNullable<PlanSnapshot['overlays']>[number];

/** A print-size copy of an overlay image: at most `overlayPrintMaxSidePx` a side, JPEG unless it has transparency (PNG). */
export async function printSizeImage(bytes: Buffer): Promise<PrintImage> {
  const side = GEOMETRY_LIMITS.overlayPrintMaxSidePx;
  const image = sharp(bytes, { limitInputPixels: GEOMETRY_LIMITS.overlayMaxPixels, failOn: 'error' }).rotate();
  const meta = await image.metadata();
  const resized = image.resize({ width: side, height: side, fit: 'inside', withoutEnlargement: true });
  if (meta.hasAlpha) return { bytes: await resized.png({ compressionLevel: 7 }).toBuffer(), kind: 'png' };
  return { bytes: await resized.jpeg({ quality: 80, mozjpeg: true }).toBuffer(), kind: 'jpeg' };
}

const dataUrl = (img: PrintImage): string => `data:image/${img.kind};base64,${img.bytes.toString('base64')}`;
const kindOfKey = (key: string): 'png' | 'jpeg' => (key.endsWith('.png') ? 'png' : 'jpeg');

async function printedOverlays(propertyId: number, firmId: number, transaction?: Transaction): Promise<Overlay[]> {
  return Overlay.findAll({ where: { firmId, propertyId, inDocuments: true }, order: [['createdAt', 'ASC'], ['id', 'ASC']], limit: 8, transaction });
}

/** The property's overlays marked for print as they stand now (the plan PDF, a draft proposal). An unreadable file is logged and left out. */
export async function liveOverlaysForPrint(propertyId: number, firmId: number): Promise<PlanMapOverlay[]> {
  const out: PlanMapOverlay[] = [];
  for (const o of await printedOverlays(propertyId, firmId)) {
    try {
      const img = await printSizeImage(await readFile(o.storageKey));
      out.push({ image: dataUrl(img), corners: o.corners, opacity: o.opacity, credit: o.name });
    } catch (err) {
      logger.warn({ err, overlayId: o.id }, 'aerial photo could not be prepared for print; the plan prints without it');
    }
  }
  return out;
}

/**
 * For a proposal's frozen snapshot: a print-size copy of each overlay marked for print is kept under
 * its own key (folder `prints/`, never swept or replaced), so deleting, hiding or re-marking the
 * overlay later does not change a sent proposal's map.
 */
export async function freezeOverlaysForPrint(propertyId: number, firmId: number, transaction?: Transaction): Promise<FrozenOverlay[]> {
  const out: FrozenOverlay[] = [];
  for (const o of await printedOverlays(propertyId, firmId, transaction)) {
    try {
      const img = await printSizeImage(await readFile(o.storageKey));
      const printKey = await saveFile('prints', img.bytes, img.kind === 'png' ? 'png' : 'jpg');
      out.push({ name: o.name, corners: o.corners.map(([lon, lat]) => [lon, lat] as [number, number]), opacity: o.opacity, printKey });
    } catch (err) {
      logger.warn({ err, overlayId: o.id }, 'aerial photo could not be kept for print; the proposal is sent without it');
    }
  }
  return out;
}

/** The frozen overlays of a sent proposal read back from their print copies. A missing copy is logged and left out. */
export async function frozenOverlaysForPrint(frozen: readonly FrozenOverlay[]): Promise<PlanMapOverlay[]> {
  const out: PlanMapOverlay[] = [];
  for (const o of frozen) {
    try {
      const bytes = await readFile(o.printKey);
      out.push({ image: dataUrl({ bytes, kind: kindOfKey(o.printKey) }), corners: o.corners, opacity: o.opacity, credit: o.name });
    } catch (err) {
      logger.warn({ err, printKey: o.printKey }, 'kept aerial photo could not be read; the proposal prints without it');
    }
  }
  return out;
}
