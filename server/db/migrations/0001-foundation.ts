import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/** Accounts, projects, memberships, sessions and the audit trail. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'engineer', 'viewer'), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.createTable('projects', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    standard: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'as4100' },
    default_grade: { type: DataTypes.STRING(60), allowNull: false },
    created_by_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    ...timestamps,
  });
  await qi.createTable('project_members', {
    project_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('project_members', ['user_id']);
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['expires']);
  await qi.createTable('audit_entries', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    actor_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    project_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'projects', key: 'id' }, onDelete: 'CASCADE' },
    action: { type: DataTypes.STRING(60), allowNull: false },
    subject: { type: DataTypes.STRING(200), allowNull: false },
    detail: { type: DataTypes.JSON, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('audit_entries', ['project_id', 'created_at']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  for (const table of ['audit_entries', 'sessions', 'project_members', 'projects', 'users']) await qi.dropTable(table);
}
