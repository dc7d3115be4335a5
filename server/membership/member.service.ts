/** Project members: list, add, change role, remove (admins and the project's leads). */
import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import {
  addMemberSchema,
  updateMemberSchema,
  type AddMemberInput,
  type ProjectMember,
  type ProjectRole,
  type UpdateMemberInput,
} from '../../shared/schemas/membership.js';
import type { Role } from '../../shared/schemas/users.js';
import { badRequest, conflict, notFound } from '../errors/app-error.js';
import { UserEntity, type UserRecord } from '../users/user.entity.js';
import { ProjectMemberEntity, type ProjectMemberRecord } from './member.entity.js';

function toMember(m: ProjectMemberRecord, u: UserRecord): ProjectMember {
  return {
    projectId: m.projectId,
    userId: m.userId,
    email: u.email,
    name: u.name,
    role: m.role,
    accountRole: u.role,
    active: u.active,
    addedAt: m.createdAt.toISOString(),
  };
}

export async function listMembers(ds: DataSource, projectId: number): Promise<ProjectMember[]> {
  const rows = await ds.getRepository(ProjectMemberEntity).find({ where: { projectId }, order: { id: 'ASC' } });
  const users = await ds.getRepository(UserEntity).findBy({ id: In(rows.map((r) => r.userId)) });
  const byId = new Map(users.map((u) => [u.id, u]));
  return rows.filter((r) => byId.has(r.userId)).map((r) => toMember(r, byId.get(r.userId)!));
}

/** The project role a new project's creator gets: their account role, at most lead. */
export function creatorRole(accountRole: Role): ProjectRole {
  return accountRole === 'admin' ? 'lead' : accountRole;
}

/** Adds (or keeps) `userId` as a member; used for creators, invitations and the seed. */
export async function ensureMember(m: EntityManager, projectId: number, userId: number, role: ProjectRole): Promise<void> {
  const repo = m.getRepository(ProjectMemberEntity);
  if (!(await repo.existsBy({ projectId, userId }))) await repo.save(repo.create({ projectId, userId, role }));
}

export async function addMember(ds: DataSource, projectId: number, input: AddMemberInput): Promise<ProjectMember> {
  const data = addMemberSchema.parse(input);
  const users = ds.getRepository(UserEntity);
  const user = data.userId !== undefined ? await users.findOneBy({ id: data.userId }) : await users.findOneBy({ email: data.email! });
  if (!user) {
    throw badRequest('No user with that e-mail; ask an admin to invite them first', { fieldErrors: { email: ['No such user'] }, formErrors: [] });
  }
  const repo = ds.getRepository(ProjectMemberEntity);
  if (await repo.existsBy({ projectId, userId: user.id })) {
    throw conflict(`${user.email} is already a member of this project`, { fieldErrors: { email: ['Already a member'] }, formErrors: [] });
  }
  const saved = await repo.save(repo.create({ projectId, userId: user.id, role: data.role }));
  return toMember(saved, user);
}

async function findMember(ds: DataSource, projectId: number, userId: number): Promise<{ member: ProjectMemberRecord; user: UserRecord }> {
  const member = await ds.getRepository(ProjectMemberEntity).findOneBy({ projectId, userId });
  const user = member ? await ds.getRepository(UserEntity).findOneBy({ id: userId }) : null;
  if (!member || !user) throw notFound(`User ${userId} is not a member of project ${projectId}`);
  return { member, user };
}

/** A lead who is not an admin cannot demote or remove themself (someone else must do it). */
function guardSelf(actor: UserRecord, userId: number, what: string): void {
  if (actor.role !== 'admin' && actor.id === userId) throw badRequest(`You cannot ${what} yourself; ask another lead or an admin`);
}

export async function updateMember(ds: DataSource, actor: UserRecord, projectId: number, userId: number, input: UpdateMemberInput): Promise<ProjectMember> {
  const data = updateMemberSchema.parse(input);
  const { member, user } = await findMember(ds, projectId, userId);
  if (data.role !== 'lead') guardSelf(actor, userId, 'demote');
  member.role = data.role;
  return toMember(await ds.getRepository(ProjectMemberEntity).save(member), user);
}

export async function removeMember(ds: DataSource, actor: UserRecord, projectId: number, userId: number): Promise<ProjectMember> {
  const { member, user } = await findMember(ds, projectId, userId);
  guardSelf(actor, userId, 'remove');
  const gone = toMember(member, user);
  await ds.getRepository(ProjectMemberEntity).remove(member);
  return gone;
}

/** Active members whose effective role on the project is lead (not admins unless members). */
export async function projectLeads(ds: DataSource, projectId: number): Promise<UserRecord[]> {
  const rows = await ds.getRepository(ProjectMemberEntity).findBy({ projectId, role: 'lead' });
  const users = await ds.getRepository(UserEntity).findBy({ id: In(rows.map((r) => r.userId)) });
  return users.filter((u) => u.active && (u.role === 'lead' || u.role === 'admin'));
}
