import type { Transaction } from 'sequelize';

interface BatchConnection {
  batch(sql: string, values: unknown[][]): Promise<unknown>;
}

/** Rows per round trip: bounded so one statement stays far below max_allowed_packet. */
const ROWS_PER_BATCH = 2000;

/**
 * Inserts many rows through the MariaDB driver's bulk protocol inside a Sequelize
 * transaction: one prepared statement, values sent in binary, no SQL text to build or
 * escape. Used where an import writes tens of thousands of rows with large JSON values.
 * `table` and `columns` are names from our own code, never from a request.
 */
export async function batchInsert(transaction: Transaction, table: string, columns: readonly string[], rows: unknown[][]): Promise<void> {
  if (!rows.length) return;
  const connection = (transaction as unknown as { connection: BatchConnection }).connection;
  const sql = `INSERT INTO \`${table}\` (${columns.map((c) => `\`${c}\``).join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`;
  for (let i = 0; i < rows.length; i += ROWS_PER_BATCH) await connection.batch(sql, rows.slice(i, i + ROWS_PER_BATCH));
}
