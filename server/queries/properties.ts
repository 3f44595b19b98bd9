/** Reads of the firm's properties as the API answers them: each with its client's name and unit count. */
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Client, Property } from '../models';
import { presentProperty } from '../presenters/property';
import type { z } from 'zod';
import type { PropertyListQuerySchema } from '../../shared/schemas/property';

type PropertyListQuery = z.output<typeof PropertyListQuerySchema>;

/** Unit counts per property, one query. */
export async function unitCounts(firmId: number, propertyIds: number[]): Promise<Map<number, number>> {
  if (propertyIds.length === 0) return new Map();
  const rows = await sequelize.query<{ property_id: number; n: string }>(
    'SELECT property_id, count(*) AS n FROM units WHERE firm_id = :firmId AND property_id IN (:ids) GROUP BY property_id',
    { replacements: { firmId, ids: propertyIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((row) => [row.property_id, Number(row.n)]));
}

/** One property as the API answers it: its client's name and its unit count beside its own fields. */
export async function propertyAnswer(firmId: number, property: Property) {
  const [client, counts] = await Promise.all([Client.findByPk(property.clientId, { attributes: ['name'] }), unitCounts(firmId, [property.id])]);
  return presentProperty(property, client?.name ?? '', counts.get(property.id) ?? 0);
}

/** One page of the firm's properties by name (optionally one client's, or names containing `q`), and how many match. */
export async function listProperties(firmId: number, query: PropertyListQuery) {
  const { clientId, q } = query;
  const where: WhereOptions = { firmId, ...(clientId ? { clientId } : {}), ...(q ? { name: { [Op.iLike]: `%${q}%` } } : {}) };
  const [total, properties] = await Promise.all([
    Property.count({ where }),
    Property.findAll({ where, include: [{ model: Client, as: 'client', attributes: ['name'] }], order: [['name', 'ASC'], ['id', 'ASC']], limit: query.limit, offset: query.offset }),
  ]);
  const counts = await unitCounts(firmId, properties.map((p) => p.id));
  const rows = properties.map((p) => presentProperty(p, (p as Property & { client?: Client }).client?.name ?? '', counts.get(p.id) ?? 0));
  return { rows, total };
}
