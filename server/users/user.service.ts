/** Users: listing, creating and changing them (admin), and the public view of a user. */
import type { DataSource } from 'typeorm';
import type { CreateUserInput, UpdateUserInput, User } from '../../shared/schemas/users.js';
import { createUserSchema, updateUserSchema } from '../../shared/schemas/users.js';
import { hashPassword } from '../auth/password.js';
import { badRequest, conflict, notFound } from '../errors/app-error.js';
import { UserEntity, type UserRecord } from './user.entity.js';

export function toUser(u: UserRecord): User {
  return { id: u.id, email: u.email, name: u.name, role: u.role, active: u.active };
}

export async function listUsers(ds: DataSource): Promise<User[]> {
  const rows = await ds.getRepository(UserEntity).find({ order: { email: 'ASC' } });
  return rows.map(toUser);
}

export async function createUser(ds: DataSource, input: CreateUserInput): Promise<User> {
  const data = createUserSchema.parse(input);
  const repo = ds.getRepository(UserEntity);
  if (await repo.existsBy({ email: data.email })) {
    throw conflict(`A user with e-mail ${data.email} already exists`, { fieldErrors: { email: ['Already in use'] }, formErrors: [] });
  }
  const saved = await repo.save(
    repo.create({ email: data.email, name: data.name, role: data.role, passwordHash: await hashPassword(data.password), active: true, sessionVersion: 0 }),
  );
  return toUser(saved);
}

/** Changes name, role or active. An admin cannot demote or deactivate themself (someone must stay admin). */
export async function updateUser(ds: DataSource, actor: UserRecord, id: number, input: UpdateUserInput): Promise<User> {
  const data = updateUserSchema.parse(input);
  const repo = ds.getRepository(UserEntity);
  const user = await repo.findOneBy({ id });
  if (!user) throw notFound(`User ${id} not found`);
  if (user.id === actor.id && ((data.role !== undefined && data.role !== 'admin') || data.active === false)) {
    throw badRequest('You cannot remove your own admin role or deactivate yourself; ask another admin');
  }
  if (data.name !== undefined) user.name = data.name;
  if (data.role !== undefined) user.role = data.role;
  if (data.active !== undefined && data.active !== user.active) {
    user.active = data.active;
    if (!data.active) user.sessionVersion += 1;
  }
  return toUser(await repo.save(user));
}
