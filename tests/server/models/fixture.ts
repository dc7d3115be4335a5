/**
 * A small demo model of our own (invented numbers: demo data) as CSV files, and helpers to
 * import it through the API. Two-span continuous beam along X, Y up, EN 1993-1-1.
 */
import type { TestApp } from '../helpers/test-app.js';

export const CSV: Record<string, string> = {
  'settings.csv': 'key,value\ntitle,Two-span demo beam\nunits,metric\ndesign_code,en1993-1-1\n',
  'materials.csv': 'material,E [MPa],nu,fy [MPa],fu [MPa],density [kg/m3],alpha [1/C]\nSteel355,210000,0.3,355,490,7850,0.000012\n',
  'sections.csv': 'section,shape,d [mm],bf [mm],tf [mm],tw [mm]\nB300,i,300,150,10.7,7.1\nB400,i,400,180,13.5,8.6\n',
  'nodes.csv': 'node,x [m],y [m]\nN1,0,0\nN2,6,0\nN3,12,0\n',
  'supports.csv': 'node,ux,uy\nN1,1,1\nN2,0,1\nN3,0,1\n',
  'members.csv': 'member,start,end,section,material,group\nM1,N1,N2,B300,Steel355,beams\nM2,N2,N3,B300,Steel355,beams\n',
  'cases.csv': 'case,category,title,self_weight\nD,dead,Dead load,1\nL,live,Floor load,0\n',
  'member_loads.csv': 'case,member,kind,direction,w1\nD,M1,uniform,global_y,-5\nD,M2,uniform,global_y,-5\nL,M1,uniform,global_y,-12\nL,M2,uniform,global_y,-12\n',
  'combinations.csv': 'combination,case,factor,limit_state\nULS,D,1.35,strength\nULS,L,1.5,strength\nSLS,D,1,service\nSLS,L,1,service\n',
};

export function withFile(name: string, text: string): Record<string, string> {
  return { ...CSV, [name]: text };
}

export async function upload(t: TestApp, projectId: number, files: Record<string, string>, fields: Record<string, string> = {}) {
  let req = t.as('engineer').post(`/api/projects/${projectId}/imports`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  for (const [name, text] of Object.entries(files)) req = req.attach('files', Buffer.from(text, 'utf8'), name);
  return req;
}

export async function newProject(t: TestApp, name = 'Test project'): Promise<number> {
  const res = await t.as('engineer').post('/api/projects').send({ name });
  if (res.status !== 201) throw new Error(`project: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as number;
}

/** Imports the demo model and returns the model id (version 1). */
export async function importDemo(t: TestApp, projectId: number): Promise<number> {
  const preview = await upload(t, projectId, CSV);
  if (preview.status !== 201 || !preview.body.canCommit) throw new Error(`preview: ${preview.status} ${JSON.stringify(preview.body)}`);
  const commit = await t.as('engineer').post(`/api/projects/${projectId}/imports/${preview.body.id}/commit`).send({});
  if (commit.status !== 201) throw new Error(`commit: ${commit.status} ${JSON.stringify(commit.body)}`);
  return commit.body.model.id as number;
}
