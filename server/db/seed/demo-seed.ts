import type { Sequelize } from 'sequelize';
import { UserModel } from '../models/user';
import { ProjectModel } from '../models/project';
import { ProjectMemberModel } from '../models/project-member';
import { hashPassword } from '../../auth/passwords';
import type { Role } from '@shared/api/roles';

export const DEMO_PASSWORD = 'gaugeline-demo';
export const DEMO_EMAIL_DOMAIN = 'demo.gaugeline.test';
export const DEMO_ACCOUNTS: readonly { email: string; name: string; role: Role }[] = [
  { email: `admin@${DEMO_EMAIL_DOMAIN}`, name: 'Ada Okafor (demo admin)', role: 'admin' },
  { email: `engineer@${DEMO_EMAIL_DOMAIN}`, name: 'Ewan Marsh (demo engineer)', role: 'engineer' },
  { email: `architect@${DEMO_EMAIL_DOMAIN}`, name: 'Aiko Brandt (demo architect)', role: 'viewer' },
];
export const DEMO_PROJECT = {
  name: 'Kestrel Yard maintenance shed',
  description:
    'Invented demo project: a single-storey steel-framed maintenance shed with an angle roof truss, flat and rod bracing, and hangers with bolted ends.',
  standard: 'as4100' as const,
  defaultGrade: 'AS/NZS 3679.1-300',
};

/** Seeds the demo accounts and project, only into an empty database. Returns whether it seeded. */
export async function seedDemoIfEmpty(sequelize: Sequelize): Promise<boolean> {
  if ((await UserModel.count()) > 0) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    const users = [];
    for (const account of DEMO_ACCOUNTS) users.push(await UserModel.create({ ...account, passwordHash, lastSignInAt: null }, { transaction }));
    const engineer = users.find((u) => u.role === 'engineer')!;
    const project = await ProjectModel.create({ ...DEMO_PROJECT, createdById: engineer.id }, { transaction });
    await ProjectMemberModel.bulkCreate(users.map((u) => ({ projectId: project.id, userId: u.id })), { transaction });
  });
  return true;
}

/** Production refuses to run while demo accounts exist. */
export async function countDemoAccounts(): Promise<number> {
  const { Op } = await import('sequelize');
  return UserModel.count({ where: { email: { [Op.like]: `%@${DEMO_EMAIL_DOMAIN}` } } });
}
