import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { withForce, type CheckResult } from '@shared/engine';

/**
 * A member's stored result becomes its capacity (the engine's result without the force, shared
 * by every member of an import checked from the same input) plus the member's design force,
 * which readers apply with the engine's withForce. An import of 20,000 members stored 90 MB
 * of results of which 97 differed; see docs/decisions/0013-capacities-stored-once.md.
 *
 * Rows from before hold the member's whole result; each becomes a capacity of its own. Their
 * text keeps the utilisation, which withForce sets again from the same force (it leaves a
 * result made with that force as it is).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('check_capacities', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'revisions', key: 'id' }, onDelete: 'CASCADE' },
    /** The capacity's number within the import that wrote it (links results while they are written). */
    import_key: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    /** The engine's result without a force: modes, trace, assumptions, warnings. */
    body: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addColumn('check_results', 'capacity_id', {
    type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'check_capacities', key: 'id' }, onDelete: 'CASCADE',
  });
  // Each earlier result becomes a capacity of its own, linked through its row id held in import_key for the moment.
  await qi.sequelize.query(`INSERT INTO check_capacities (revision_id, import_key, body, created_at)
    SELECT m.revision_id, cr.id, cr.result, cr.created_at FROM check_results cr JOIN members m ON m.id = cr.member_id ORDER BY cr.id`);
  await qi.sequelize.query('UPDATE check_results cr JOIN check_capacities cc ON cc.import_key = cr.id SET cr.capacity_id = cc.id');
  await qi.sequelize.query('UPDATE check_capacities SET import_key = NULL');
  await qi.sequelize.query('ALTER TABLE check_results MODIFY capacity_id INT UNSIGNED NOT NULL');
  await qi.removeColumn('check_results', 'result');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('check_results', 'result', { type: DataTypes.JSON, allowNull: true });
  const rows = await qi.sequelize.query<{ id: number; body: string; force: number | null }>(
    `SELECT cr.id, CAST(cc.body AS CHAR) AS body, m.design_force_n AS \`force\`
       FROM check_results cr JOIN check_capacities cc ON cc.id = cr.capacity_id JOIN members m ON m.id = cr.member_id`,
    { type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    const result = withForce(JSON.parse(r.body) as CheckResult, r.force);
    await qi.sequelize.query('UPDATE check_results SET result = ? WHERE id = ?', { replacements: [JSON.stringify(result), r.id] });
  }
  await qi.sequelize.query('ALTER TABLE check_results MODIFY result JSON NOT NULL');
  await qi.removeColumn('check_results', 'capacity_id');
  await qi.dropTable('check_capacities');
}
