import { DataTypes, type QueryInterface } from 'sequelize';

const fk = (table: string, onDelete: 'CASCADE' | 'SET NULL' = 'CASCADE') => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: onDelete === 'SET NULL',
  references: { model: table, key: 'id' },
  onDelete,
});

/**
 * Models and their revisions (one uploaded file each, with its import job state),
 * the members found in a revision, their hole patterns, forces and check results.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('models', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    project_id: fk('projects'),
    name: { type: DataTypes.STRING(160), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('models', ['project_id', 'name'], { unique: true });

  await qi.createTable('revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    model_id: fk('models'),
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    file_size: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(255), allowNull: false },
    uploaded_by_id: fk('users', 'SET NULL'),
    standard: { type: DataTypes.STRING(20), allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    failure_id: { type: DataTypes.STRING(60), allowNull: true },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    claimed_by: { type: DataTypes.STRING(80), allowNull: true },
    heartbeat_at: { type: DataTypes.DATE, allowNull: true },
    schema_name: { type: DataTypes.STRING(20), allowNull: true },
    summary: { type: DataTypes.JSON, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('revisions', ['model_id', 'number'], { unique: true });
  await qi.addIndex('revisions', ['status', 'heartbeat_at']);
  await qi.addIndex('revisions', ['sha256']);

  await qi.createTable('members', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    revision_id: fk('revisions'),
    global_id: { type: DataTypes.STRING(22), allowNull: false },
    name: { type: DataTypes.STRING(255), allowNull: true },
    tag: { type: DataTypes.STRING(120), allowNull: true },
    ifc_class: { type: DataTypes.STRING(60), allowNull: false },
    storey: { type: DataTypes.STRING(160), allowNull: true },
    assembly: { type: DataTypes.STRING(160), allowNull: true },
    profile_name: { type: DataTypes.STRING(120), allowNull: true },
    grade_name: { type: DataTypes.STRING(120), allowNull: true },
    length_mm: { type: DataTypes.DOUBLE, allowNull: true },
    is_tension: { type: DataTypes.BOOLEAN, allowNull: false },
    inclusion: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'auto' },
    inclusion_reason: { type: DataTypes.TEXT, allowNull: true },
    hole_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    design_force_n: { type: DataTypes.DOUBLE, allowNull: true },
    force_source: { type: DataTypes.STRING(40), allowNull: true },
    net_area_mm2: { type: DataTypes.DOUBLE, allowNull: true },
    design_capacity_n: { type: DataTypes.DOUBLE, allowNull: true },
    utilisation: { type: DataTypes.DOUBLE, allowNull: true },
    governing: { type: DataTypes.STRING(60), allowNull: true },
    band: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'unknown' },
    warning_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    /** Everything the member sheet needs: section, sources, signals, hole patterns, warnings. */
    detail: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('members', ['revision_id', 'global_id'], { unique: true });
  await qi.addIndex('members', ['revision_id', 'utilisation']);
  await qi.addIndex('members', ['revision_id', 'band']);

  await qi.createTable('member_forces', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    member_id: fk('members'),
    load_case: { type: DataTypes.STRING(120), allowNull: false },
    axial_n: { type: DataTypes.DOUBLE, allowNull: false },
    source: { type: DataTypes.STRING(40), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('member_forces', ['member_id']);

  await qi.createTable('check_results', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    member_id: fk('members'),
    standard: { type: DataTypes.STRING(20), allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    /** Capacities per mode, trace, assumptions and warnings, as the engine returned them. */
    result: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('check_results', ['member_id', 'standard'], { unique: true });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const t of ['check_results', 'member_forces', 'members', 'revisions', 'models']) await qi.dropTable(t);
}
