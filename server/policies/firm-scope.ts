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
