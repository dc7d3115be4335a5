/**
 * The synthetic grid frame of the API benchmark and the large-run tests (demo data of our
 * own, not a real structure): bays × bays in plan, `storeys` high, Z up, fixed bases, HEB300
 * columns and IPE400 beams in S355, dead load from self weight, 10 kN/m live load on every
 * beam, 5 kN of wind at every roof node. `frameTables(60, 10)` is the 110,410-member model of
 * issue 12 (60 × 60 × 10).
 */

/** CSV tables of a bays × bays × storeys frame, Z up. */
export function frameTables(bays = 10, storeys = 30, bay = 6, storey = 3.5): Record<string, string> {
  const n = bays + 1;
  const id = (i: number, j: number, k: number) => `N${i}_${j}_${k}`;
  const nodes = ['node,x [m],y [m],z [m]'];
  const supports = ['node,type'];
  const members = ['member,start,end,section,material,group'];
  const loads = ['case,member,kind,direction,w1'];
  const nodeLoads = ['case,node,fx [kN]'];
  for (let k = 0; k <= storeys; k++)
    for (let j = 0; j < n; j++)
      for (let i = 0; i < n; i++) {
        nodes.push(`${id(i, j, k)},${i * bay},${j * bay},${k * storey}`);
        if (k === 0) supports.push(`${id(i, j, k)},fixed`);
        if (k === storeys) nodeLoads.push(`W,${id(i, j, k)},5`);
      }
  let m = 0;
  for (let k = 1; k <= storeys; k++) {
    for (let j = 0; j < n; j++)
      for (let i = 0; i < n; i++) members.push(`C${++m},${id(i, j, k - 1)},${id(i, j, k)},HEB300,S355,columns`);
    for (let j = 0; j < n; j++)
      for (let i = 0; i < bays; i++) {
        members.push(`B${++m},${id(i, j, k)},${id(i + 1, j, k)},IPE400,S355,beams`);
        loads.push(`L,B${m},uniform,global_z,-10`);
      }
    for (let j = 0; j < bays; j++)
      for (let i = 0; i < n; i++) {
        members.push(`B${++m},${id(i, j, k)},${id(i, j + 1, k)},IPE400,S355,beams`);
        loads.push(`L,B${m},uniform,global_z,-10`);
      }
  }
  return {
    'settings.csv': 'key,value\ntitle,Synthetic frame\nunits,metric\ndesign_code,en1993-1-1\n',
    'nodes.csv': nodes.join('\n'),
    'supports.csv': supports.join('\n'),
    'members.csv': members.join('\n'),
    'cases.csv': 'case,category,self_weight\nD,dead,1\nL,live,0\nW,wind,0\n',
    'member_loads.csv': loads.join('\n'),
    'node_loads.csv': nodeLoads.join('\n'),
    'combinations.csv': 'combination,case,factor\nULS1,D,1.35\nULS1,L,1.5\nULS2,D,1.35\nULS2,L,1.05\nULS2,W,1.5\nULS3,D,1.0\nULS3,W,1.5\n',
  };
}

/** Members of frameTables(bays, storeys) without building it. */
export function frameMemberCount(bays: number, storeys: number): number {
  const n = bays + 1;
  return storeys * (n * n + 2 * bays * n);
}
