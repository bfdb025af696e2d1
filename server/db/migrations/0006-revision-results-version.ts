import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A counter that moves whenever a revision's member results change (import stored, forces
 * applied, an override). Readers that keep the member table in memory compare it on every
 * request, so several app processes sharing one database never serve stale rows.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'results_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('revisions', 'results_version');
}
