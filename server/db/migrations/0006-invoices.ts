/**
 * Invoices and payments: invoices (numbered per firm), their lines, the payments and refunds the
 * payments service reports, and the ids of webhook events already processed (idempotency).
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE invoices (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      client_id INTEGER NOT NULL REFERENCES clients(id) ON DELETE CASCADE,
      property_id INTEGER REFERENCES properties(id) ON DELETE SET NULL,
      proposal_id INTEGER REFERENCES proposals(id) ON DELETE SET NULL,
      kind TEXT NOT NULL CHECK (kind IN ('deposit','progress','final')),
      number TEXT NOT NULL,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft','open','paid','void')),
      currency TEXT NOT NULL DEFAULT 'USD',
      tax_rate_pct NUMERIC(7,4) NOT NULL DEFAULT 0,
      terms_days INTEGER NOT NULL DEFAULT 30 CHECK (terms_days BETWEEN 0 AND 365),
      notes TEXT,
      issued_on DATE,
      due_on DATE,
      subtotal_cents INTEGER NOT NULL DEFAULT 0,
      tax_cents INTEGER NOT NULL DEFAULT 0,
      total_cents INTEGER NOT NULL DEFAULT 0 CHECK (total_cents >= 0),
      billed_cents INTEGER NOT NULL DEFAULT 0,
      amount_paid_cents INTEGER NOT NULL DEFAULT 0,
      amount_refunded_cents INTEGER NOT NULL DEFAULT 0,
      sent_at TIMESTAMPTZ,
      paid_at TIMESTAMPTZ,
      voided_at TIMESTAMPTZ,
      void_reason TEXT,
      last_reminder_on DATE,
      reminder_count INTEGER NOT NULL DEFAULT 0,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (firm_id, number)
    )`);
  await q('CREATE INDEX invoices_firm_status_idx ON invoices (firm_id, status, due_on)');
  await q('CREATE INDEX invoices_client_idx ON invoices (client_id)');
  await q('CREATE INDEX invoices_proposal_idx ON invoices (proposal_id)');
  // One deposit invoice per proposal that is not void.
  await q(`CREATE UNIQUE INDEX invoices_one_deposit_idx ON invoices (proposal_id) WHERE kind = 'deposit' AND status <> 'void'`);
  await q(`CREATE UNIQUE INDEX invoices_one_final_idx ON invoices (proposal_id) WHERE kind = 'final' AND status <> 'void'`);
  await q(`
    CREATE TABLE invoice_lines (
      id SERIAL PRIMARY KEY,
      invoice_id INTEGER NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
      position INTEGER NOT NULL,
      source TEXT NOT NULL CHECK (source IN ('deposit','task','deposit-credit','final','manual')),
      task_id INTEGER REFERENCES tasks(id) ON DELETE SET NULL,
      description TEXT NOT NULL,
      quantity NUMERIC(14,4) NOT NULL DEFAULT 1,
      unit TEXT NOT NULL DEFAULT 'each',
      unit_price_cents INTEGER NOT NULL,
      amount_cents INTEGER NOT NULL,
      taxable BOOLEAN NOT NULL DEFAULT false
    )`);
  await q('CREATE INDEX invoice_lines_invoice_idx ON invoice_lines (invoice_id, position)');
  await q(`
    CREATE TABLE invoice_payments (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      invoice_id INTEGER NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
      amount_cents INTEGER NOT NULL CHECK (amount_cents > 0),
      refunded_cents INTEGER NOT NULL DEFAULT 0,
      currency TEXT NOT NULL DEFAULT 'USD',
      processor_payment_id TEXT NOT NULL UNIQUE,
      processor_session_id TEXT,
      received_at TIMESTAMPTZ NOT NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX invoice_payments_invoice_idx ON invoice_payments (invoice_id)');
  await q(`
    CREATE TABLE invoice_refunds (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      invoice_id INTEGER NOT NULL REFERENCES invoices(id) ON DELETE CASCADE,
      payment_id INTEGER NOT NULL REFERENCES invoice_payments(id) ON DELETE CASCADE,
      amount_cents INTEGER NOT NULL CHECK (amount_cents > 0),
      reason TEXT,
      processor_refund_id TEXT NOT NULL UNIQUE,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q(`
    CREATE TABLE processed_events (
      event_id TEXT PRIMARY KEY,
      type TEXT NOT NULL,
      processed_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('ALTER TABLE tasks ADD CONSTRAINT tasks_invoice_fk FOREIGN KEY (invoice_id) REFERENCES invoices(id) ON DELETE SET NULL');
  await q('CREATE INDEX tasks_invoice_idx ON tasks (invoice_id)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE tasks DROP CONSTRAINT IF EXISTS tasks_invoice_fk');
  await qi.sequelize.query('DROP INDEX IF EXISTS tasks_invoice_idx');
  for (const t of ['processed_events', 'invoice_refunds', 'invoice_payments', 'invoice_lines', 'invoices']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${t}`);
};
