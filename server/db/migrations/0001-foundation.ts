/** Foundation schema: PostGIS, firms, users, clients, properties, tokens, sessions, outbox, audit. */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q('CREATE EXTENSION IF NOT EXISTS postgis');
  await q(`
    CREATE TABLE firms (
      id SERIAL PRIMARY KEY,
      name TEXT NOT NULL,
      slug TEXT NOT NULL UNIQUE,
      email TEXT,
      phone TEXT,
      address TEXT,
      timezone TEXT NOT NULL DEFAULT 'America/Chicago',
      region TEXT NOT NULL DEFAULT 'midwest',
      settings JSONB NOT NULL DEFAULT '{}'::jsonb,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q(`
    CREATE TABLE clients (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      name TEXT NOT NULL,
      email TEXT,
      phone TEXT,
      address TEXT,
      notes TEXT,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX clients_firm_idx ON clients (firm_id)');
  await q(`
    CREATE TABLE users (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      client_id INTEGER REFERENCES clients(id) ON DELETE CASCADE,
      email TEXT NOT NULL,
      name TEXT NOT NULL,
      role TEXT NOT NULL CHECK (role IN ('owner','consultant','crew','client')),
      phone TEXT,
      password_hash TEXT,
      active BOOLEAN NOT NULL DEFAULT true,
      last_sign_in_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CONSTRAINT users_client_link CHECK ((role = 'client') = (client_id IS NOT NULL))
    )`);
  await q('CREATE UNIQUE INDEX users_email_unique ON users (lower(email))');
  await q('CREATE INDEX users_firm_idx ON users (firm_id)');
  await q(`
    CREATE TABLE properties (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      client_id INTEGER NOT NULL REFERENCES clients(id) ON DELETE CASCADE,
      name TEXT NOT NULL,
      county TEXT,
      state TEXT,
      region TEXT,
      objectives TEXT,
      notes TEXT,
      boundary geometry(MultiPolygon, 4326),
      acres NUMERIC(12,3),
      revision INTEGER NOT NULL DEFAULT 1,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX properties_firm_idx ON properties (firm_id)');
  await q('CREATE INDEX properties_client_idx ON properties (client_id)');
  await q('CREATE INDEX properties_boundary_gist ON properties USING gist (boundary)');
  await q(`
    CREATE TABLE auth_tokens (
      id SERIAL PRIMARY KEY,
      user_id INTEGER NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      purpose TEXT NOT NULL CHECK (purpose IN ('invite','reset')),
      token_hash TEXT NOT NULL UNIQUE,
      expires_at TIMESTAMPTZ NOT NULL,
      used_at TIMESTAMPTZ,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q(`
    CREATE TABLE session (
      sid VARCHAR NOT NULL PRIMARY KEY,
      sess JSON NOT NULL,
      expire TIMESTAMP(6) NOT NULL
    )`);
  await q('CREATE INDEX session_expire_idx ON session (expire)');
  await q(`
    CREATE TABLE rate_limit_hits (
      key TEXT PRIMARY KEY,
      hits INTEGER NOT NULL,
      reset_at TIMESTAMPTZ NOT NULL
    )`);
  await q(`
    CREATE TABLE outbox_messages (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER REFERENCES firms(id) ON DELETE CASCADE,
      kind TEXT NOT NULL,
      to_address TEXT NOT NULL,
      subject TEXT NOT NULL,
      text_body TEXT NOT NULL,
      html_body TEXT,
      attachments JSONB NOT NULL DEFAULT '[]'::jsonb,
      status TEXT NOT NULL DEFAULT 'pending' CHECK (status IN ('pending','sent','failed')),
      attempts INTEGER NOT NULL DEFAULT 0,
      next_attempt_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      last_error TEXT,
      sent_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q(`CREATE INDEX outbox_pending_idx ON outbox_messages (next_attempt_at) WHERE status = 'pending'`);
  await q(`
    CREATE TABLE audit_events (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER REFERENCES firms(id) ON DELETE CASCADE,
      user_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      action TEXT NOT NULL,
      subject_type TEXT,
      subject_id INTEGER,
      data JSONB NOT NULL DEFAULT '{}'::jsonb,
      ip TEXT,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX audit_events_firm_idx ON audit_events (firm_id, created_at DESC)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const t of ['audit_events', 'outbox_messages', 'rate_limit_hits', 'session', 'auth_tokens', 'properties', 'users', 'clients', 'firms']) {
    await qi.sequelize.query(`DROP TABLE IF EXISTS ${t} CASCADE`);
  }
};
