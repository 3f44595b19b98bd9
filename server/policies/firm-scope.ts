/** Ownership: every record a route touches must belong to the signed-in user's firm. */
import type { Request } from 'express';
import type { Model, ModelStatic, Transaction, WhereOptions } from 'sequelize';
import { forbidden, notFound } from '../errors';

/** The signed-in user (routes behind an access declaration always have one). */
export function actor(req: Request) {
  if (!req.user) throw forbidden();
  return req.user;
}

/** Finds a record by id within the actor's firm, or answers 404 (never revealing other firms' ids). */
export async function findInFirm<M extends Model>(
  model: ModelStatic<M>,
  id: number,
  firmId: number,
  label: string,
  options: { transaction?: Transaction; lock?: boolean } = {},
): Promise<M> {
  const row = await model.findOne({
    where: { id, firmId } as unknown as WhereOptions,
    transaction: options.transaction,
    lock: options.lock && options.transaction ? options.transaction.LOCK.UPDATE : undefined,
  });
  if (!row) throw notFound(label);
  return row;
}

/**
 * A firm's document (proposal, invoice) the actor may read: staff of its firm, or its own client
 * once it has left draft. Anyone else gets the same 404 as for a record that does not exist.
 */
export async function findIssuedInFirm<M extends Model & { clientId: number; status: string }>(
  model: ModelStatic<M>,
  id: number,
  me: { firmId: number; role: string; clientId?: number | null },
  label: string,
): Promise<M> {
  const row = await findInFirm(model, id, me.firmId, label);
  if (me.role === 'client' && (row.clientId !== me.clientId || row.status === 'draft')) throw notFound(label);
  return row;
}
