/**
 * The consultant's week and the schedule read tasks whose planned window overlaps a date range:
 * `COALESCE(start_date, earliest) <= to AND COALESCE(end_date, start_date, latest) >= from`. A
 * btree on the first date bounds only one side, so every earlier task of the firm was scanned
 * (EXPLAIN ANALYZE at ten times the data: 984 index entries and heap rows read to keep 115). A GiST
 * index on the firm and the window as a date range (btree_gist, a trusted extension shipped with
 * PostgreSQL) finds just the overlapping tasks. The range is written with LEAST/GREATEST so that no
 * row can make it invalid (a range's bounds must be in order); it is a superset of the exact test,
 * which the query keeps beside it.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS btree_gist');
  await qi.sequelize.query(
    `CREATE INDEX IF NOT EXISTS tasks_firm_window_idx ON tasks USING gist (firm_id,
       daterange(LEAST(COALESCE(start_date, earliest), COALESCE(end_date, start_date, latest)),
                 GREATEST(COALESCE(start_date, earliest), COALESCE(end_date, start_date, latest)), '[]'))`,
  );
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS tasks_firm_window_idx');
  // The extension stays: other database objects may have come to use it.
};
