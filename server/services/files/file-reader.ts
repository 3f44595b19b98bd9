/** Lists of shared files, with their property and uploader names, for staff and for a client's portal. */
import type { WhereOptions } from 'sequelize';
import { Property, SharedFile, User } from '../../models';
import { presentSharedFile } from '../../presenters/shared-file';
import type { SharedFileDto } from '../../../shared/schemas/file';

/** Presents rows with the names of their property and uploader (two queries, whatever the count). */
export async function presentFiles(rows: SharedFile[]): Promise<SharedFileDto[]> {
  const propertyIds = [...new Set(rows.map((r) => r.propertyId).filter((id): id is number => id !== null))];
  const userIds = [...new Set(rows.map((r) => r.uploadedById).filter((id): id is number => id !== null))];
  const [properties, users] = await Promise.all([
    Property.findAll({ where: { id: propertyIds.length ? propertyIds : [0] }, attributes: ['id', 'name'] }),
    User.findAll({ where: { id: userIds.length ? userIds : [0] }, attributes: ['id', 'name'] }),
  ]);
  const propertyName = new Map(properties.map((p) => [p.id, p.name]));
  const userName = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => presentSharedFile(r, { propertyName: r.propertyId ? (propertyName.get(r.propertyId) ?? null) : null, uploadedByName: r.uploadedById ? (userName.get(r.uploadedById) ?? null) : null }));
}

/** The files a client sees: its own, visible to it (client uploads always are), newest first. */
export async function clientVisibleFiles(firmId: number, clientId: number, propertyId?: number): Promise<SharedFileDto[]> {
  const where: Record<string, unknown> = { firmId, clientId, visibleToClient: true };
  if (propertyId) where.propertyId = propertyId;
  return presentFiles(await SharedFile.findAll({ where: where as WhereOptions, order: [['createdAt', 'DESC'], ['id', 'DESC']] }));
}

/** The firm's files, optionally for one client or property, newest first. */
export async function staffFiles(firmId: number, filter: { clientId?: number; propertyId?: number }): Promise<SharedFileDto[]> {
  const where: Record<string, unknown> = { firmId };
  if (filter.clientId) where.clientId = filter.clientId;
  if (filter.propertyId) where.propertyId = filter.propertyId;
  return presentFiles(await SharedFile.findAll({ where: where as WhereOptions, order: [['createdAt', 'DESC'], ['id', 'DESC']] }));
}
