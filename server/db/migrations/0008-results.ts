/**
 * Results of a season: trail-camera surveys (tallies and the camera sites used), harvest records,
 * and the season reports made for the landowner (the PDF itself is a shared file).
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE camera_surveys (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      name TEXT NOT NULL,
      start_date DATE NOT NULL,
      end_date DATE NOT NULL,
      season INTEGER NOT NULL,
      buck_photos INTEGER NOT NULL CHECK (buck_photos >= 0),
      unique_bucks INTEGER NOT NULL CHECK (unique_bucks >= 1 AND unique_bucks <= buck_photos),
      doe_photos INTEGER NOT NULL CHECK (doe_photos >= 0),
      fawn_photos INTEGER NOT NULL CHECK (fawn_photos >= 0),
      bucks JSONB NOT NULL DEFAULT '[]'::jsonb,
      camera_unit_ids JSONB NOT NULL DEFAULT '[]'::jsonb,
      camera_count INTEGER NOT NULL CHECK (camera_count >= 1),
      notes TEXT,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CHECK (start_date <= end_date)
    )`);
  await q('CREATE INDEX camera_surveys_property_idx ON camera_surveys (property_id, start_date)');
  await q(`
    CREATE TABLE harvest_records (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      date DATE NOT NULL,
      season INTEGER NOT NULL,
      sex TEXT NOT NULL CHECK (sex IN ('male','female')),
      age_class TEXT NOT NULL CHECK (age_class IN ('fawn','1.5','2.5','3.5','4.5','5.5+')),
      dressed_weight_lb NUMERIC(5,1) CHECK (dressed_weight_lb IS NULL OR dressed_weight_lb > 0),
      antler_points INTEGER CHECK (antler_points IS NULL OR antler_points >= 0),
      unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      stand TEXT,
      hunter TEXT,
      notes TEXT,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX harvest_records_property_idx ON harvest_records (property_id, date)');
  await q(`
    CREATE TABLE season_reports (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      client_id INTEGER NOT NULL REFERENCES clients(id) ON DELETE CASCADE,
      season INTEGER NOT NULL,
      recommendations TEXT,
      shared_file_id INTEGER NOT NULL REFERENCES shared_files(id) ON DELETE CASCADE,
      sent_at TIMESTAMPTZ,
      sent_to JSONB NOT NULL DEFAULT '[]'::jsonb,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX season_reports_property_idx ON season_reports (property_id, season)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const t of ['season_reports', 'harvest_records', 'camera_surveys']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${t}`);
};
