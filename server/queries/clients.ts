/** Reads of the firm's clients: how many properties and acres each has. */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** Property count and acres per client of a firm, in one query. */
export async function clientStats(firmId: number, clientIds?: number[]): Promise<Map<number, { propertyCount: number; totalAcres: number }>> {
  const rows = await sequelize.query<{ client_id: number; n: string; acres: string | null }>(
    `SELECT client_id, count(*) AS n, sum(acres) AS acres FROM properties WHERE firm_id = :firmId ${clientIds ? 'AND client_id IN (:clientIds)' : ''} GROUP BY client_id`,
    { replacements: { firmId, clientIds: clientIds?.length ? clientIds : [0] }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((row) => [row.client_id, { propertyCount: Number(row.n), totalAcres: Number(row.acres ?? 0) }]));
}
