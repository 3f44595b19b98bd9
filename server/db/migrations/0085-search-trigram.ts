/**
 * Search everything: PostgreSQL's pg_trgm (a trusted extension shipped with Debian's PostgreSQL) and
 * trigram indexes on what the header search matches — client, property and contact names, contact
 * e-mails, proposal and invoice numbers — so a typo still finds the record.
 */
import type { MigrationFn } from '../migrator';

const INDEXES: [name: string, table: string, expression: string, where?: string][] = [
  ['clients_name_trgm_idx', 'clients', 'lower(name)'],
  ['properties_name_trgm_idx', 'properties', 'lower(name)'],
  ['proposals_number_trgm_idx', 'proposals', 'lower(number)'],
  ['invoices_number_trgm_idx', 'invoices', 'lower(number)'],
  ['users_contact_name_trgm_idx', 'users', 'lower(name)', 'client_id IS NOT NULL'],
  ['users_contact_email_trgm_idx', 'users', 'lower(email)', 'client_id IS NOT NULL'],
];

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  for (const [name, table, expression, where] of INDEXES) {
    await qi.sequelize.query(`CREATE INDEX IF NOT EXISTS ${name} ON ${table} USING gin ((${expression}) gin_trgm_ops)${where ? ` WHERE ${where}` : ''}`);
  }
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const [name] of INDEXES) await qi.sequelize.query(`DROP INDEX IF EXISTS ${name}`);
  // The extension stays: other databases objects may have come to use it.
};
