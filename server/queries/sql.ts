// The one way the query modules talk to PostgreSQL: named replacements (`:name`), never values spliced into the text,
// and the caller's transaction passed through.
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import { readsFromPrimary } from '../db-freshness.ts';

export interface InTransaction {
  transaction?: Transaction;
}

type Replacements = Record<string, unknown>;

// An INSERT/UPDATE/DELETE … RETURNING also comes back as rows; it must reach the primary even on a replica's turn.
const READ_ONLY = /^\s*(SELECT\b|WITH\b(?![\s\S]*\b(INSERT|UPDATE|DELETE)\b))/i;
const writes = (sql: string) => !READ_ONLY.test(sql);

/** Rows of a SELECT (or of a statement with RETURNING). */
export const selectRows = <Row extends object>(sql: string, replacements?: Replacements, { transaction }: InTransaction = {}) =>
  sequelize.query<Row>(sql, { replacements, type: QueryTypes.SELECT, transaction, useMaster: readsFromPrimary() || writes(sql) });

/** The first row, or undefined. */
export const selectRow = async <Row extends object>(sql: string, replacements?: Replacements, options: InTransaction = {}) =>
  (await selectRows<Row>(sql, replacements, options))[0] as Row | undefined;

/** A statement whose rows nobody reads. */
export const execute = async (sql: string, replacements?: Replacements, { transaction }: InTransaction = {}) => {
  await sequelize.query(sql, { replacements, transaction });
};
