/** Projects: list, read, create, change, delete. */
import type { DataSource } from 'typeorm';
import {
  createProjectSchema,
  updateProjectSchema,
  type CreateProjectInput,
  type Project,
  type UpdateProjectInput,
} from '../../shared/schemas/projects.js';
import { notFound } from '../errors/app-error.js';
import { ProjectEntity, type ProjectRecord } from './project.entity.js';

export function toProject(p: ProjectRecord): Project {
  return {
    id: p.id,
    name: p.name,
    jobNumber: p.jobNumber,
    client: p.client,
    description: p.description,
    designCode: p.designCode,
    units: p.units,
    createdBy: p.createdBy,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

/** Newest change first. */
export async function listProjects(ds: DataSource): Promise<Project[]> {
  const rows = await ds.getRepository(ProjectEntity).find({ order: { updatedAt: 'DESC', id: 'DESC' } });
  return rows.map(toProject);
}

export async function findProject(ds: DataSource, id: number): Promise<ProjectRecord> {
  const project = await ds.getRepository(ProjectEntity).findOneBy({ id });
  if (!project) throw notFound(`Project ${id} not found`);
  return project;
}

export async function getProject(ds: DataSource, id: number): Promise<Project> {
  return toProject(await findProject(ds, id));
}

export async function createProject(ds: DataSource, createdBy: number | null, input: CreateProjectInput): Promise<Project> {
  const data = createProjectSchema.parse(input);
  const repo = ds.getRepository(ProjectEntity);
  return toProject(await repo.save(repo.create({ ...data, createdBy })));
}

export async function updateProject(ds: DataSource, id: number, input: UpdateProjectInput): Promise<Project> {
  const data = updateProjectSchema.parse(input);
  const repo = ds.getRepository(ProjectEntity);
  const project = await findProject(ds, id);
  Object.assign(project, data);
  return toProject(await repo.save(project));
}

export async function deleteProject(ds: DataSource, id: number): Promise<void> {
  const project = await findProject(ds, id);
  await ds.getRepository(ProjectEntity).remove(project);
}
