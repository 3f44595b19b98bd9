/** Plan units (any geometry, SRID 4326) and georeferenced image overlays of a property. */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE units (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      kind TEXT NOT NULL CHECK (kind IN ('food-plot','cover-planting','timber','bedding-area','sanctuary','water','other-area',
                                         'access-route','firebreak','fence','stand-site','camera-site','mock-scrape','water-source','gate')),
      name TEXT NOT NULL,
      notes TEXT,
      geometry geometry(Geometry, 4326) NOT NULL,
      acres NUMERIC(14,4),
      perimeter_ft NUMERIC(14,1),
      length_ft NUMERIC(14,1),
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX units_property_idx ON units (property_id)');
  await q('CREATE INDEX units_firm_idx ON units (firm_id)');
  await q('CREATE INDEX units_geometry_gist ON units USING gist (geometry)');
  await q('ALTER TABLE properties ADD COLUMN perimeter_ft NUMERIC(14,1)');
  await q(`
    CREATE TABLE overlays (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      name TEXT NOT NULL,
      storage_key TEXT NOT NULL,
      content_type TEXT NOT NULL,
      byte_size INTEGER NOT NULL,
      corners JSONB NOT NULL,
      opacity NUMERIC(3,2) NOT NULL DEFAULT 0.8,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX overlays_property_idx ON overlays (property_id)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS overlays');
  await qi.sequelize.query('DROP TABLE IF EXISTS units');
  await qi.sequelize.query('ALTER TABLE properties DROP COLUMN IF EXISTS perimeter_ft');
};
