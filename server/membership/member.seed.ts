/** Demo data: every demo account is a member of every demo project with its own role (admin: not needed). */
import type { SeedContext } from '../db/seed.js';
import { ProjectMemberEntity } from './member.entity.js';

export async function seedProjectMembers(seed: SeedContext): Promise<void> {
  const repo = seed.manager.getRepository(ProjectMemberEntity);
  for (const project of seed.projects) {
    for (const role of ['lead', 'engineer', 'viewer'] as const) {
      await repo.save(repo.create({ projectId: project.id, userId: seed.users[role].id, role }));
    }
  }
}
