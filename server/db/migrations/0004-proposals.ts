/** Proposals (versioned, priced from prescriptions), their lines and the client's approval record. */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE proposals (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      client_id INTEGER NOT NULL REFERENCES clients(id) ON DELETE CASCADE,
      series_id INTEGER,
      number TEXT NOT NULL,
      version INTEGER NOT NULL DEFAULT 1,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft','sent','approved','declined','withdrawn')),
      title TEXT NOT NULL,
      introduction TEXT,
      terms TEXT NOT NULL DEFAULT '',
      currency TEXT NOT NULL DEFAULT 'USD',
      discount JSONB NOT NULL DEFAULT '{"kind":"none"}'::jsonb,
      tax_rate_pct NUMERIC(7,4) NOT NULL DEFAULT 0,
      deposit_pct NUMERIC(7,4) NOT NULL DEFAULT 0,
      expires_on DATE,
      subtotal_cents INTEGER NOT NULL DEFAULT 0,
      discount_cents INTEGER NOT NULL DEFAULT 0,
      tax_cents INTEGER NOT NULL DEFAULT 0,
      total_cents INTEGER NOT NULL DEFAULT 0,
      deposit_cents INTEGER NOT NULL DEFAULT 0,
      sent_at TIMESTAMPTZ,
      first_viewed_at TIMESTAMPTZ,
      decided_at TIMESTAMPTZ,
      decline_reason TEXT,
      withdrawn_at TIMESTAMPTZ,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (firm_id, number, version)
    )`);
  await q('CREATE INDEX proposals_property_idx ON proposals (property_id)');
  await q('CREATE INDEX proposals_client_idx ON proposals (client_id, status)');
  await q(`
    CREATE TABLE proposal_lines (
      id SERIAL PRIMARY KEY,
      proposal_id INTEGER NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
      position INTEGER NOT NULL,
      unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      prescription_id INTEGER REFERENCES prescriptions(id) ON DELETE SET NULL,
      group_label TEXT NOT NULL,
      category TEXT NOT NULL CHECK (category IN ('materials','labor','equipment','fees')),
      description TEXT NOT NULL,
      quantity NUMERIC(14,4) NOT NULL,
      unit TEXT NOT NULL,
      unit_price_cents INTEGER NOT NULL,
      taxable BOOLEAN NOT NULL DEFAULT false,
      optional BOOLEAN NOT NULL DEFAULT false,
      selected BOOLEAN NOT NULL DEFAULT true
    )`);
  await q('CREATE INDEX proposal_lines_proposal_idx ON proposal_lines (proposal_id, position)');
  await q(`
    CREATE TABLE proposal_approvals (
      id SERIAL PRIMARY KEY,
      proposal_id INTEGER NOT NULL UNIQUE REFERENCES proposals(id) ON DELETE CASCADE,
      user_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      signed_name TEXT NOT NULL,
      signed_at TIMESTAMPTZ NOT NULL,
      ip TEXT,
      user_agent TEXT,
      content_hash TEXT NOT NULL,
      content TEXT NOT NULL,
      selected_option_ids JSONB NOT NULL DEFAULT '[]'::jsonb,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q(`CREATE TABLE firm_counters (firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE, name TEXT NOT NULL, value INTEGER NOT NULL DEFAULT 0, PRIMARY KEY (firm_id, name))`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const t of ['firm_counters', 'proposal_approvals', 'proposal_lines', 'proposals']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${t}`);
};
