import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createDatabase } from '../../server/db/database';
import { batchInsert } from '../../server/db/batch-insert';
import { createTestDatabase, testDbServer } from '../support/test-db';

// The import stores members and results through batchInsert (the driver's bulk protocol).
// Driver 3.0.2 altered about one value in a thousand once a batch passed ~4 MB, silently
// (decision 0011): these batches are that size, with the non-ASCII text results carry.
describe('batchInsert through the app connection', () => {
  let db: { name: string; drop(): Promise<void> };
  let sequelize: Sequelize;

  beforeAll(async () => {
    db = await createTestDatabase();
    const s = testDbServer();
    sequelize = createDatabase({ name: db.name, user: s.user, password: s.password, host: s.host, port: s.port, poolMax: 2 } as Parameters<typeof createDatabase>[0]);
    await sequelize.query('CREATE TABLE batch_probe (id INT UNSIGNED AUTO_INCREMENT PRIMARY KEY, n INT NOT NULL, body JSON NOT NULL, note LONGTEXT NOT NULL)');
  });

  afterAll(async () => {
    await sequelize?.close();
    await db?.drop();
  });

  it('stores every value of multi-megabyte batches intact', async () => {
    const rows = (count: number, batch: number, noteLength = 4494) => Array.from({ length: count }, (_, i) => {
      const n = batch * 10_000 + i;
      const body = JSON.stringify({ n, trace: Array.from({ length: 24 }, (_, k) => ({ symbol: `φNt${k}`, unit: 'mm²', substituted: `0.9 × ${n + k}` })) });
      return [n, body, `${String(n).padStart(6, '0')}${'x'.repeat(noteLength)}`];
    });
    // The last batch is larger than MariaDB's packet limit (16 MB here): the driver must split it.
    const batches = [rows(1000, 0), rows(2000, 1), rows(1500, 2, 11_000)];
    const bytes = (b: unknown[][]) => b.reduce((sum, r) => sum + Buffer.byteLength(String(r[1])) + String(r[2]).length, 0);
    expect(bytes(batches[1])).toBeGreaterThan(8e6);
    const [[{ packet }]] = (await sequelize.query('SELECT @@max_allowed_packet AS packet')) as [{ packet: number }[], unknown];
    expect(bytes(batches[2])).toBeGreaterThan(Number(packet));
    await sequelize.transaction(async (transaction) => {
      for (const b of batches) await batchInsert(transaction, 'batch_probe', ['n', 'body', 'note'], b);
    });
    const stored = await sequelize.query<{ n: number; body: string; note: string }>('SELECT n, CAST(body AS CHAR) AS body, note FROM batch_probe ORDER BY n', { type: QueryTypes.SELECT });
    const sent = batches.flat();
    expect(stored).toHaveLength(sent.length);
    const altered = stored.filter((row, i) => row.n !== sent[i][0] || row.body !== sent[i][1] || row.note !== sent[i][2]);
    expect(altered.map((row) => row.n)).toEqual([]);
  });

  // Driver 3.5.4 starts a new bulk command at every change of a value's type from the first
  // row's (and at every Date); alikeRows keeps a batch one command (decision 0015).
  it('sends a batch of dates, nulls and mixed numbers as one command, every value intact', async () => {
    await sequelize.query('CREATE TABLE batch_kinds (id INT UNSIGNED AUTO_INCREMENT PRIMARY KEY, whole INT NULL, x DOUBLE NULL, flag TINYINT(1) NOT NULL, maybe TINYINT(1) NULL, label VARCHAR(40) NULL, at DATETIME(3) NOT NULL)');
    const at = new Date(Date.UTC(2026, 11, 2, 23, 59, 58, 765));
    const doubles = [0.1, 1 / 3, -2.5e-300, 6.02214076e23, 1e21, 2 ** 31, -(2 ** 31) - 1, 123456789.00000001, 75000, 0];
    const rows = Array.from({ length: 600 }, (_, i) => [
      i % 7 === 0 ? null : i,
      i % 5 === 0 ? null : doubles[i % doubles.length] * (i % 2 ? 1 : -1) + (i % 3 === 0 ? 0 : i / 7),
      i % 2 === 0,
      i % 3 === 0 ? null : i % 2 === 1,
      i % 4 === 0 ? null : `row ${i}`,
      at,
    ]);
    let commands = 0;
    await sequelize.transaction(async (transaction) => {
      // Status counters are per connection: read them on the transaction's own.
      const count = async () => {
        const [[row]] = (await sequelize.query("SHOW SESSION STATUS LIKE 'Com_stmt_execute'", { transaction })) as [{ Value: string }[], unknown];
        return Number(row.Value);
      };
      const before = await count();
      await batchInsert(transaction, 'batch_kinds', ['whole', 'x', 'flag', 'maybe', 'label', 'at'], rows);
      commands = (await count()) - before;
    });
    expect(commands).toBe(1);
    const stored = await sequelize.query<{ whole: number | null; x: number | null; flag: number; maybe: number | null; label: string | null; at: string }>(
      "SELECT whole, x, flag, maybe, label, DATE_FORMAT(at, '%Y-%m-%d %H:%i:%s.%f') AS at FROM batch_kinds ORDER BY id", { type: QueryTypes.SELECT },
    );
    expect(stored.map((r) => [r.whole, r.x, r.flag === 1, r.maybe === null ? null : r.maybe === 1, r.label])).toEqual(rows.map((r) => r.slice(0, 5)));
    // Stored as UTC, as Sequelize writes dates (timezone '+00:00').
    expect(new Set(stored.map((r) => r.at))).toEqual(new Set(['2026-12-02 23:59:58.765000']));
  });

  it('answers raw queries (Sequelize deletes the driver result meta)', async () => {
    const [rows] = await sequelize.query('SELECT 1 AS x');
    expect(rows).toEqual([{ x: 1 }]);
  });
});
