/** The firm's logo: checked by its bytes (PNG or JPEG only), its size and its pixels before it is kept. */
import { readImageSize, type ImageSize } from '../../shared/domain/image-size';
import { LOGO_LIMITS } from '../../shared/limits';
import { payloadTooLarge, unprocessable, unsupportedMedia } from '../errors';

/** What a person reads when the logo is over the size limit. */
export const LOGO_TOO_LARGE = `The logo is larger than ${LOGO_LIMITS.maxBytes / 1024 / 1024} MB. Save it smaller (a PNG or JPEG about 600 pixels wide is plenty).`;

/** The logo's kind and size, or the error a person can act on. */
export function checkLogo(bytes: Buffer): ImageSize {
  if (bytes.length > LOGO_LIMITS.maxBytes) throw payloadTooLarge(LOGO_TOO_LARGE);
  const size = readImageSize(bytes);
  if (!size) throw unsupportedMedia('The logo must be a PNG or JPEG image. Save it in one of those formats and upload it again.');
  if (size.width > LOGO_LIMITS.maxSide || size.height > LOGO_LIMITS.maxSide) {
    throw unprocessable(`The logo is ${size.width} × ${size.height} pixels; the limit is ${LOGO_LIMITS.maxSide} on each side. Save it smaller and upload it again.`);
  }
  if (size.width < LOGO_LIMITS.minSide || size.height < LOGO_LIMITS.minSide) {
    throw unprocessable(`The logo is ${size.width} × ${size.height} pixels; it needs at least ${LOGO_LIMITS.minSide} on each side to print clearly.`);
  }
  return size;
}
