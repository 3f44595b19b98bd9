/** The firm's practice library (materials, service rates, practices) and prescriptions on units. */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  for (const table of ['materials', 'service_rates', 'practices']) {
    await q(`
      CREATE TABLE ${table} (
        id SERIAL PRIMARY KEY,
        firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
        key TEXT NOT NULL,
        name TEXT NOT NULL,
        definition JSONB NOT NULL,
        archived BOOLEAN NOT NULL DEFAULT false,
        created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
        updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
        UNIQUE (firm_id, key)
      )`);
  }
  await q(`
    CREATE TABLE prescriptions (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER NOT NULL REFERENCES units(id) ON DELETE CASCADE,
      practice_id INTEGER NOT NULL REFERENCES practices(id) ON DELETE RESTRICT,
      year INTEGER NOT NULL,
      target_date DATE,
      count INTEGER,
      notes TEXT,
      parameters JSONB NOT NULL DEFAULT '{}'::jsonb,
      result JSONB NOT NULL,
      schedule JSONB NOT NULL,
      cautions JSONB NOT NULL DEFAULT '[]'::jsonb,
      summary TEXT NOT NULL,
      total_cents INTEGER NOT NULL,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX prescriptions_unit_idx ON prescriptions (unit_id)');
  await q('CREATE INDEX prescriptions_property_idx ON prescriptions (property_id)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const table of ['prescriptions', 'practices', 'service_rates', 'materials']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${table}`);
};
