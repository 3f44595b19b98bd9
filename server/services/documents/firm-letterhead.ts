/** The firm's letterhead for a PDF: the profile (live or as kept in a sent document's snapshot) with its logo read from storage. */
import type { DocumentFirm } from '../../../shared/schemas/firm';
import type { LetterheadFirm } from '../../../templates/documents/firm-block';
import { readFile } from '../storage/storage';
import { readImageSize } from '../../../shared/domain/image-size';
import { logger } from '../../logger';

/** The letterhead's firm with the logo as a data URL; a logo file that cannot be read is left out (the document still renders). */
export async function letterheadFirm(firm: DocumentFirm): Promise<LetterheadFirm> {
  const { logoKey, ...rest } = firm;
  let logo: string | null = null;
  if (logoKey) {
    try {
      const bytes = await readFile(logoKey);
      const size = readImageSize(bytes);
      if (size) logo = `data:image/${size.kind};base64,${bytes.toString('base64')}`;
    } catch (err) {
      logger.warn({ err, logoKey }, 'firm logo could not be read; the document prints without it');
    }
  }
  return { ...rest, logo };
}
