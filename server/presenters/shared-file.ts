import type { SharedFile } from '../models';
import type { SharedFileDto } from '../../shared/schemas/file';

/** A shared file as the API answers it; the download URL checks ownership again. */
export function presentSharedFile(f: SharedFile, names: { propertyName?: string | null; uploadedByName?: string | null } = {}): SharedFileDto {
  return {
    id: f.id,
    clientId: f.clientId,
    propertyId: f.propertyId,
    propertyName: names.propertyName ?? null,
    category: f.category,
    title: f.title,
    contentType: f.contentType,
    byteSize: f.byteSize,
    visibleToClient: f.visibleToClient,
    uploadedByRole: f.uploadedByRole,
    uploadedByName: names.uploadedByName ?? null,
    url: `/api/files/${f.id}`,
    createdAt: f.createdAt.toISOString(),
  };
}
