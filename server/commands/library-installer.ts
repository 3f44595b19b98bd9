/** Gives a firm the starter practice library (materials, rates, practices); idempotent by key. */
import type { Transaction } from 'sequelize';
import { Material, Practice, ServiceRateEntry } from '../models';
import { STARTER_MATERIALS, STARTER_PRACTICES, STARTER_RATES } from '../../shared/domain/starter-library';

/** Adds every starter entry the firm does not have yet; answers how many were added. */
export async function installStarterLibrary(firmId: number, transaction?: Transaction): Promise<number> {
  let added = 0;
  const sets = [
    { model: Material, entries: STARTER_MATERIALS },
    { model: ServiceRateEntry, entries: STARTER_RATES },
    { model: Practice, entries: STARTER_PRACTICES },
  ] as const;
  for (const { model, entries } of sets) {
    const existing = new Set((await (model as typeof Material).findAll({ where: { firmId }, attributes: ['key'], transaction })).map((row) => row.key));
    const rows = entries.filter((e) => !existing.has(e.key)).map((e) => ({ firmId, key: e.key, name: e.name, definition: e }));
    if (rows.length) await (model as typeof Material).bulkCreate(rows as never[], { transaction });
    added += rows.length;
  }
  return added;
}
