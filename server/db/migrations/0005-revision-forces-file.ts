import { DataTypes, type QueryInterface } from 'sequelize';

/** A forces table that arrives with the model file and is applied when the revision is checked. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('revisions', 'forces_storage_key', { type: DataTypes.STRING(255), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('revisions', 'forces_storage_key');
}
