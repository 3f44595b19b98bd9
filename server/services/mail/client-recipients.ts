/** Who hears from the firm on a client's behalf: the client's active portal contacts, or the client's own e-mail when it has none. */
import type { Transaction } from 'sequelize';
import { Client, User } from '../../models';

/** The addresses to write to about a client's land, proposals, invoices and reports. */
export async function clientRecipients(clientId: number, transaction?: Transaction): Promise<string[]> {
  const contacts = await User.findAll({ where: { clientId, role: 'client', active: true }, attributes: ['email'], order: [['id', 'ASC']], transaction });
  const emails = contacts.map((c) => c.email);
  if (emails.length === 0) {
    const client = await Client.findByPk(clientId, { attributes: ['email'], transaction });
    if (client?.email) emails.push(client.email);
  }
  return emails;
}
