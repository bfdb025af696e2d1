import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import * as m0001 from './migrations/0001-foundation';
import * as m0002 from './migrations/0002-models-and-results';
import * as m0004 from './migrations/0004-mail-and-tokens';
import * as m0005 from './migrations/0005-revision-forces-file';
import * as m0006 from './migrations/0006-revision-results-version';
import * as m0007 from './migrations/0007-check-capacities';

// Migrations are listed explicitly (not globbed) so that the same list works under
// tsx, vitest and a bundled build, and the order is reviewed in code.
const MIGRATIONS = [
  { name: '0001-foundation', module: m0001 },
  { name: '0002-models-and-results', module: m0002 },
  { name: '0004-mail-and-tokens', module: m0004 },
  { name: '0005-revision-forces-file', module: m0005 },
  { name: '0006-revision-results-version', module: m0006 },
  { name: '0007-check-capacities', module: m0007 },
];

export function createMigrator(sequelize: Sequelize) {
  const qi = sequelize.getQueryInterface();
  return new Umzug({
    migrations: MIGRATIONS.map(({ name, module }) => ({
      name,
      up: () => module.up({ context: qi }),
      down: () => module.down({ context: qi }),
    })),
    context: qi,
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies pending migrations; returns the names applied. Never alters tables by model sync. */
export async function migrateToLatest(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
