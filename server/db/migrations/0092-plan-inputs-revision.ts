/**
 * The plan's revision covers everything its summary is made of, so the whole summary (the map's
 * warnings and the season's: plant-back intervals and rotation) can be cached by revision and a warm
 * plan read is one small revision query. Units already bump the revision in their commands; these
 * triggers bump it, in the same transaction as the write, when any other input changes:
 * a property's tasks or prescriptions (its own plan), and the firm's materials (plant-back days, seed
 * species), practices (what a prescription sows) and settings (the hunting route buffer), which feed
 * every plan of the firm. Statement-level triggers with transition tables: a bulk write bumps each
 * plan once; an update bumps only when a column the summary reads changed.
 */
import type { MigrationFn } from '../migrator';

/** [table, scope, columns the plan summary reads]: scope `property` bumps the rows' properties, `firm` every plan of the rows' firms. */
const INPUTS: [table: string, scope: 'property' | 'firm', columns: string[]][] = [
  ['tasks', 'property', ['property_id', 'unit_id', 'unit_name', 'kind', 'name', 'earliest', 'start_date', 'done_on', 'quantities', 'status']],
  ['prescriptions', 'property', ['property_id', 'unit_id', 'practice_id', 'year']],
  ['materials', 'firm', ['firm_id', 'key', 'name', 'definition']],
  ['practices', 'firm', ['firm_id', 'definition']],
  ['firms', 'firm', ['settings']],
];

const keyOf = (table: string, scope: 'property' | 'firm') => (scope === 'property' ? 'property_id' : table === 'firms' ? 'id' : 'firm_id');

export const up: MigrationFn = async ({ context: qi }) => {
  for (const [table, scope, columns] of INPUTS) {
    const key = keyOf(table, scope);
    const target = scope === 'property' ? 'id' : 'firm_id';
    const changed = columns.map((c) => `n.${c} IS DISTINCT FROM o.${c}`).join(' OR ');
    await qi.sequelize.query(`
      CREATE FUNCTION ${table}_bump_plan_revision() RETURNS trigger AS $$
      BEGIN
        IF TG_OP = 'INSERT' THEN
          UPDATE properties SET revision = revision + 1 WHERE ${target} IN (SELECT ${key} FROM new_rows);
        ELSIF TG_OP = 'DELETE' THEN
          UPDATE properties SET revision = revision + 1 WHERE ${target} IN (SELECT ${key} FROM old_rows);
        ELSE
          UPDATE properties SET revision = revision + 1 WHERE ${target} IN (
            SELECT n.${key} FROM new_rows n JOIN old_rows o ON o.id = n.id WHERE ${changed}
            UNION SELECT o.${key} FROM new_rows n JOIN old_rows o ON o.id = n.id WHERE ${changed});
        END IF;
        RETURN NULL;
      END $$ LANGUAGE plpgsql`);
    await qi.sequelize.query(`CREATE TRIGGER ${table}_plan_revision_insert AFTER INSERT ON ${table} REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION ${table}_bump_plan_revision()`);
    await qi.sequelize.query(`CREATE TRIGGER ${table}_plan_revision_update AFTER UPDATE ON ${table} REFERENCING NEW TABLE AS new_rows OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION ${table}_bump_plan_revision()`);
    await qi.sequelize.query(`CREATE TRIGGER ${table}_plan_revision_delete AFTER DELETE ON ${table} REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION ${table}_bump_plan_revision()`);
  }
};

export const down: MigrationFn = async ({ context: qi }) => {
  for (const [table] of INPUTS) {
    for (const op of ['insert', 'update', 'delete']) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${table}_plan_revision_${op} ON ${table}`);
    await qi.sequelize.query(`DROP FUNCTION IF EXISTS ${table}_bump_plan_revision()`);
  }
};
