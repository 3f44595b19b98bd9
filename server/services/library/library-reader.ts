/** The firm's library as the domain computations take it. */
import type { Transaction } from 'sequelize';
import { Material, ServiceRateEntry } from '../../models';
import type { MaterialDefinition } from '../../../shared/domain/practice';
import type { ServiceRate } from '../../../shared/domain/service-rates';

/** Every material and rate of the firm (archived ones too: older prescriptions still use them). */
export async function loadLibrary(firmId: number, transaction?: Transaction): Promise<{ materials: MaterialDefinition[]; rates: ServiceRate[] }> {
  const [materials, rates] = await Promise.all([
    Material.findAll({ where: { firmId }, transaction }),
    ServiceRateEntry.findAll({ where: { firmId }, transaction }),
  ]);
  return { materials: materials.map((m) => ({ ...m.definition, key: m.key })), rates: rates.map((r) => ({ ...r.definition, key: r.key })) };
}
