/**
 * The work schedule: tasks made from approved prescriptions' steps, their completion photos, the crew's
 * private calendar feeds, and the files a consultant shares with a client (and, where allowed, the
 * client's own uploads).
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE tasks (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      prescription_id INTEGER REFERENCES prescriptions(id) ON DELETE SET NULL,
      proposal_id INTEGER REFERENCES proposals(id) ON DELETE SET NULL,
      step_key TEXT NOT NULL,
      name TEXT NOT NULL,
      kind TEXT NOT NULL,
      practice_name TEXT NOT NULL,
      unit_name TEXT NOT NULL,
      depends_on JSONB NOT NULL DEFAULT '[]'::jsonb,
      earliest DATE NOT NULL,
      latest DATE NOT NULL,
      start_date DATE,
      end_date DATE,
      status TEXT NOT NULL DEFAULT 'planned' CHECK (status IN ('planned','scheduled','done','skipped')),
      assignee_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      quantities JSONB NOT NULL DEFAULT '[]'::jsonb,
      cautions JSONB NOT NULL DEFAULT '[]'::jsonb,
      cost_cents INTEGER NOT NULL DEFAULT 0,
      position INTEGER NOT NULL DEFAULT 0,
      done_on DATE,
      completed_at TIMESTAMPTZ,
      completed_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      notes TEXT,
      hours NUMERIC(7,2),
      quantities_used JSONB NOT NULL DEFAULT '[]'::jsonb,
      skip_reason TEXT,
      completion_key TEXT,
      invoice_id INTEGER,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CHECK (start_date IS NULL OR end_date IS NULL OR start_date <= end_date),
      UNIQUE (prescription_id, step_key)
    )`);
  await q('CREATE UNIQUE INDEX tasks_completion_key_idx ON tasks (firm_id, completion_key) WHERE completion_key IS NOT NULL');
  await q('CREATE INDEX tasks_property_idx ON tasks (property_id, status)');
  await q('CREATE INDEX tasks_assignee_idx ON tasks (assignee_id, status)');
  await q('CREATE INDEX tasks_firm_dates_idx ON tasks (firm_id, start_date)');
  await q(`
    CREATE TABLE task_photos (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      task_id INTEGER NOT NULL REFERENCES tasks(id) ON DELETE CASCADE,
      storage_key TEXT NOT NULL,
      original_name TEXT,
      content_type TEXT NOT NULL,
      byte_size INTEGER NOT NULL,
      latitude DOUBLE PRECISION,
      longitude DOUBLE PRECISION,
      taken_at TIMESTAMPTZ,
      uploaded_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX task_photos_task_idx ON task_photos (task_id)');
  await q(`
    CREATE TABLE calendar_feeds (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      user_id INTEGER NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      token_hash TEXT NOT NULL UNIQUE,
      revoked_at TIMESTAMPTZ,
      last_used_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX calendar_feeds_user_idx ON calendar_feeds (user_id)');
  await q(`
    CREATE TABLE shared_files (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      client_id INTEGER NOT NULL REFERENCES clients(id) ON DELETE CASCADE,
      property_id INTEGER REFERENCES properties(id) ON DELETE CASCADE,
      category TEXT NOT NULL CHECK (category IN ('soil-test','map','season-report','proposal','invoice','photo','other','client-upload')),
      title TEXT NOT NULL,
      storage_key TEXT NOT NULL,
      original_name TEXT,
      content_type TEXT NOT NULL,
      byte_size INTEGER NOT NULL,
      visible_to_client BOOLEAN NOT NULL DEFAULT true,
      uploaded_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      uploaded_by_role TEXT NOT NULL DEFAULT 'staff' CHECK (uploaded_by_role IN ('staff','client')),
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX shared_files_client_idx ON shared_files (client_id, property_id)');
  await q('ALTER TABLE clients ADD COLUMN portal_uploads_allowed BOOLEAN NOT NULL DEFAULT false');
  await q('ALTER TABLE properties ADD COLUMN notify_client_on_unit_done BOOLEAN NOT NULL DEFAULT false');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE properties DROP COLUMN IF EXISTS notify_client_on_unit_done');
  await qi.sequelize.query('ALTER TABLE clients DROP COLUMN IF EXISTS portal_uploads_allowed');
  for (const t of ['shared_files', 'calendar_feeds', 'task_photos', 'tasks']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${t}`);
};
