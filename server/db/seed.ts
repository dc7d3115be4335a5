/**
 * Demo data for a NEW database only: the four demo accounts and two demo projects of our
 * own invention, then every hook in `seedHooks` in order, all in one transaction.
 *
 * To seed more demo data (models, runs…): write `async function seedX(seed: SeedContext)`
 * next to your noun, using `seed.manager` for every write, and append it to `seedHooks`.
 */
import type { DataSource, EntityManager } from 'typeorm';
import type { Role } from '../../shared/schemas/users.js';
import { hashPassword } from '../auth/password.js';
import { ProjectEntity, type ProjectRecord } from '../projects/project.entity.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { seedSampleModels } from '../models/model.seed.js';
import { seedProjectMembers } from '../membership/member.seed.js';

export const DEMO_PASSWORD = 'trestle-demo';

export const DEMO_ACCOUNTS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@example.com', name: 'Ada Admin', role: 'admin' },
  { email: 'lead@example.com', name: 'Lena Lead', role: 'lead' },
  { email: 'engineer@example.com', name: 'Eli Engineer', role: 'engineer' },
  { email: 'viewer@example.com', name: 'Vic Viewer', role: 'viewer' },
];

export interface SeedContext {
  dataSource: DataSource;
  /** Transactional manager: use it for every write. */
  manager: EntityManager;
  /** The demo account of each role. */
  users: Record<Role, UserRecord>;
  /** The demo projects, in the order created: [footbridge, roof trusses]. */
  projects: ProjectRecord[];
}

export type SeedHook = (seed: SeedContext) => Promise<void>;

/** Run after the demo users and projects exist. Append yours. */
export const seedHooks: SeedHook[] = [seedProjectMembers, seedSampleModels];

/**
 * The four demo accounts (also used alone by the API tests, which pass one precomputed hash
 * of DEMO_PASSWORD to save time).
 */
export async function seedDemoAccounts(manager: EntityManager, demoPasswordHash?: string): Promise<Record<Role, UserRecord>> {
  const repo = manager.getRepository(UserEntity);
  const users = {} as Record<Role, UserRecord>;
  for (const account of DEMO_ACCOUNTS) {
    const passwordHash = demoPasswordHash ?? (await hashPassword(DEMO_PASSWORD));
    users[account.role] = await repo.save(repo.create({ ...account, passwordHash, active: true, sessionVersion: 0 }));
  }
  return users;
}

/**
 * What the demo projects hold: the models seeded from samples/ (server/models/model.seed.ts puts
 * the metric samples in the first project and the US ones in the second). Kept in step with
 * scripts/samples/ by tests/samples/descriptions.test.ts.
 */
export const DEMO_PROJECT_DESCRIPTIONS = {
  metric:
    'Demo project (invented data), metric, EN 1993-1-1. A 30 m steel footbridge of two Pratt trusses (10 panels of 3 m, ' +
    '3.2 m deep); beside it a process plant platform (3D, braced), the main truss of a 48 m road bridge with a design ' +
    'vehicle crossing it (bridge partial factors of EN 1993-2: γM1 = 1.10), and a three-storey workshop moment frame ' +
    'analysed to second order.',
  us:
    'Demo project (invented data), US units, AISC 360-22 (LRFD). One frame of a two-bay storage shed: a pitched portal ' +
    'frame of W-shape columns and rafters on pinned bases, frames at 25 ft centres, with roof, snow (drift in bay 2), ' +
    'wind and hoist loads.',
} as const;

export async function seedDemoData(dataSource: DataSource): Promise<void> {
  await dataSource.transaction(async (manager) => {
    const users = await seedDemoAccounts(manager);
    const projectRepo = manager.getRepository(ProjectEntity);
    const projects = await projectRepo.save([
      projectRepo.create({
        name: 'Kestrel Creek footbridge',
        jobNumber: 'DEMO-101',
        client: 'Demo: Riverside Parks Trust',
        description: DEMO_PROJECT_DESCRIPTIONS.metric,
        designCode: 'en1993-1-1',
        units: 'metric',
        createdBy: users.engineer.id,
      }),
      projectRepo.create({
        name: 'Granary Row store roof',
        jobNumber: 'DEMO-102',
        client: 'Demo: Granary Row Holdings',
        description: DEMO_PROJECT_DESCRIPTIONS.us,
        designCode: 'aisc360-lrfd',
        units: 'us',
        createdBy: users.lead.id,
      }),
    ]);
    const seed: SeedContext = { dataSource, manager, users, projects };
    for (const hook of seedHooks) await hook(seed);
  });
}

/**
 * The first admin of a server started without demo data: created only while the users table
 * is empty. Returns true when it was created.
 */
export async function seedFirstAdmin(dataSource: DataSource, email: string, password: string): Promise<boolean> {
  const repo = dataSource.getRepository(UserEntity);
  if ((await repo.count()) > 0) return false;
  await repo.save(
    repo.create({ email: email.trim().toLowerCase(), name: 'Administrator', role: 'admin', passwordHash: await hashPassword(password), active: true, sessionVersion: 0 }),
  );
  return true;
}
