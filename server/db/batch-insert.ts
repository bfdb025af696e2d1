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
 * Values go through `alikeRows` first, so that a batch travels as a few packets (decision 0015).
 */
export async function batchInsert(transaction: Transaction, table: string, columns: readonly string[], rows: unknown[][]): Promise<void> {
  if (!rows.length) return;
  const connection = (transaction as unknown as { connection: BatchConnection }).connection;
  const sql = `INSERT INTO \`${table}\` (${columns.map((c) => `\`${c}\``).join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`;
  for (let i = 0; i < rows.length; i += ROWS_PER_BATCH) await connection.batch(sql, alikeRows(rows.slice(i, i + ROWS_PER_BATCH)));
}

const isInt32 = (v: number) => Number.isInteger(v) && v >= -2147483648 && v < 2147483647;

/**
 * The same rows with every column typed alike from row to row. The driver sends rows in one
 * bulk packet only while each value has the type the packet's first row gave its column, and
 * starts a new packet (a command of its own for MariaDB) at every change: a number that is whole
 * in one row and not in the next, a null before a number, and — in driver 3.5.4 — every Date,
 * which it writes as DATETIME but then compares with TIMESTAMP. An import's rows all carry a
 * Date, so each row went as its own command (60,000 writes to the socket for 20,000 members).
 * Dates become their UTC text, as Sequelize (timezone '+00:00') writes them; booleans become 1
 * and 0, as TINYINT(1) stores them; the numbers of a column that mixes whole and fractional
 * numbers or nulls become their shortest round-trip text, which MariaDB reads back to the same
 * double (tests/api/batch-insert.test.ts).
 * Non-finite numbers are left as they are (MariaDB refuses them either way).
 */
export function alikeRows(rows: unknown[][]): unknown[][] {
  rows = rows.map((row) => row.map((v) => (typeof v === 'boolean' ? Number(v) : v)));
  const width = rows[0]?.length ?? 0;
  const asText: boolean[] = [];
  for (let c = 0; c < width; c++) {
    let whole = false;
    let fractional = false;
    let nulls = false;
    for (const row of rows) {
      const v = row[c];
      if (typeof v === 'number') {
        if (isInt32(v)) whole = true;
        else fractional = true;
      } else if (v === null || v === undefined) nulls = true;
    }
    asText.push((whole && fractional) || ((whole || fractional) && nulls));
  }
  // An import stamps all its rows with one Date: its text is worked out once.
  let lastTime = NaN;
  let lastText = '';
  for (const row of rows) {
    for (let c = 0; c < width; c++) {
      const v = row[c];
      if (v instanceof Date) {
        const t = v.getTime();
        if (t !== lastTime) {
          lastTime = t;
          lastText = utcText(v);
        }
        row[c] = lastText;
      } else if (asText[c] && typeof v === 'number' && Number.isFinite(v)) row[c] = String(v);
    }
  }
  return rows;
}

/** 'YYYY-MM-DD hh:mm:ss.mmm' in UTC. */
function utcText(d: Date): string {
  return d.toISOString().replace('T', ' ').slice(0, 23);
}
