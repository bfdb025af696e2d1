import * as mariadb from 'mariadb';

/**
 * The MariaDB driver as Sequelize's `dialectModule` (decision 0011).
 *
 * Driver 3.0.2 sent corrupted values in the bulk protocol once a batch passed about 4 MB
 * (one row in a thousand altered, silently, or the batch refused), which the import's
 * store uses for members and results; 3.1 and later send them intact. Those versions make
 * a result's `meta` non-configurable, and Sequelize 6 deletes it from every raw query's
 * result ("Cannot delete property 'meta'"). Connections made here hand Sequelize results
 * whose `meta` can be deleted; `execute` and `batch`, which our own code calls directly,
 * are left as the driver made them.
 */
export const mariadbForSequelize = {
  ...mariadb,
  async createConnection(options: mariadb.ConnectionConfig): Promise<mariadb.Connection> {
    const connection = await mariadb.createConnection(options);
    const query = connection.query.bind(connection) as (...args: unknown[]) => Promise<unknown>;
    (connection as { query: unknown }).query = async (...args: unknown[]) => withDeletableMeta(await query(...args));
    return connection;
  },
};

/** The same result with `meta` as an ordinary (deletable, not enumerable) property. */
function withDeletableMeta<T>(result: T): T {
  if (!Array.isArray(result) || !Object.prototype.hasOwnProperty.call(result, 'meta')) return result;
  const copy = result.slice() as unknown[] & { meta?: unknown };
  Object.defineProperty(copy, 'meta', { value: (result as { meta?: unknown }).meta, writable: true, configurable: true, enumerable: false });
  return copy as T;
}
