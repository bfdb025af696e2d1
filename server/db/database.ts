import { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';
import { mariadbForSequelize } from './mariadb-driver';
import { initUserModel, UserModel } from './models/user';
import { initProjectModel, ProjectModel } from './models/project';
import { initProjectMemberModel, ProjectMemberModel } from './models/project-member';
import { initSessionRecordModel } from './models/session-record';
import { initAuditEntryModel } from './models/audit-entry';
import { initIfcModelModel } from './models/ifc-model';
import { initRevisionModel } from './models/revision';
import { initMemberModel } from './models/member';
import { initMemberForceModel } from './models/member-force';
import { initCheckResultModel } from './models/check-result';
import { initMailMessageModel } from './models/mail-message';
import { initOneTimeTokenModel } from './models/one-time-token';

/** Opens the connection pool and registers every model. Does not touch the schema (see migrate.ts). */
export function createDatabase(config: AppConfig['db']): Sequelize {
  const sequelize = new Sequelize(config.name, config.user, config.password, {
    host: config.host,
    port: config.port,
    dialect: 'mariadb',
    dialectModule: mariadbForSequelize,
    logging: false,
    pool: { max: config.poolMax, min: 0, acquire: 10_000, idle: 10_000 },
    dialectOptions: { connectTimeout: 5_000 },
    timezone: '+00:00',
    define: { underscored: true },
  });
  initUserModel(sequelize);
  initProjectModel(sequelize);
  initProjectMemberModel(sequelize);
  initSessionRecordModel(sequelize);
  initAuditEntryModel(sequelize);
  initIfcModelModel(sequelize);
  initRevisionModel(sequelize);
  initMemberModel(sequelize);
  initMemberForceModel(sequelize);
  initCheckResultModel(sequelize);
  initMailMessageModel(sequelize);
  initOneTimeTokenModel(sequelize);

  ProjectModel.belongsToMany(UserModel, { through: ProjectMemberModel, foreignKey: 'projectId', otherKey: 'userId', as: 'members' });
  UserModel.belongsToMany(ProjectModel, { through: ProjectMemberModel, foreignKey: 'userId', otherKey: 'projectId', as: 'projects' });
  ProjectMemberModel.belongsTo(UserModel, { foreignKey: 'userId', as: 'user' });
  ProjectMemberModel.belongsTo(ProjectModel, { foreignKey: 'projectId', as: 'project' });
  return sequelize;
}

/** True when a trivial query succeeds within the pool's acquire timeout. */
export async function isDatabaseUp(sequelize: Sequelize): Promise<boolean> {
  try {
    await sequelize.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
