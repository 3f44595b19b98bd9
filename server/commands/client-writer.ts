/** Creates and edits the firm's clients, each in a transaction with its audit record. */
import { sequelize } from '../db/sequelize';
import { Client } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { ClientCreateInput, ClientUpdateInput } from '../../shared/schemas/client';
import { findInFirm } from '../policies/firm-scope';
import { recordAudit } from './audit-recorder';

/** Adds a client to the actor's firm. */
export async function createClient(me: SessionUser, input: ClientCreateInput, ip: string | null): Promise<Client> {
  return sequelize.transaction(async (transaction) => {
    const created = await Client.create({ firmId: me.firmId, name: input.name, email: input.email ?? null, phone: input.phone ?? null, address: input.address ?? null, notes: input.notes ?? null }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'client.created', subjectType: 'Client', subjectId: created.id, ip }, transaction);
    return created;
  });
}

/** Edits a client of the actor's firm (404 for any other). */
export async function updateClient(me: SessionUser, clientId: number, input: ClientUpdateInput, ip: string | null): Promise<Client> {
  return sequelize.transaction(async (transaction) => {
    const client = await findInFirm(Client, clientId, me.firmId, 'That client', { transaction, lock: true });
    await client.update(input, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'client.updated', subjectType: 'Client', subjectId: client.id, data: { keys: Object.keys(input) }, ip }, transaction);
    return client;
  });
}
