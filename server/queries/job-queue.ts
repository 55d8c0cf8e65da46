// pg-boss's own statements run on the caller's transaction, so a queued job commits (or rolls back) with the rows it
// works on: no row is left waiting for a job that was never queued, and no job points at a row that was never stored.
import { QueryTypes, type Transaction } from 'sequelize';
import type PgBoss from 'pg-boss';
import { sequelize } from '../db.ts';

/** A pg-boss `db` that runs its SQL (numbered $1… parameters) inside `transaction`. */
export function jobsInTransaction(transaction: Transaction): PgBoss.Db {
  return {
    // pg reads an undefined parameter as NULL; Sequelize refuses it, so the options pg-boss leaves unset become NULL here.
    executeSql: async (text, values) => ({
      rows: await sequelize.query(text, { bind: values.map((v) => (v === undefined ? null : v)), type: QueryTypes.SELECT, transaction }),
    }),
  };
}
