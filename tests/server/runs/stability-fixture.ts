/** A small frame for the stability tests of runs. */
/** A fixed-base portal frame of our own (invented numbers: demo data), Y up, 6 m × 4 m. */
export const PORTAL: Record<string, string> = {
  'settings.csv': 'key,value\ntitle,Stability portal\nunits,metric\ndesign_code,en1993-1-1\nmodes,3\nbuckling_modes,2\n',
  'materials.csv': 'material,E [MPa],nu,fy [MPa],fu [MPa],density [kg/m3]\nS355,210000,0.3,355,490,7850\n',
  'sections.csv': 'section,shape,d [mm],bf [mm],tf [mm],tw [mm]\nCOL,i,200,200,15,9\nBM,i,300,150,10.7,7.1\n',
  'nodes.csv': 'node,x [m],y [m]\nA,0,0\nB,0,4\nC,6,4\nD,6,0\n',
  'supports.csv': 'node,ux,uy,rz\nA,1,1,1\nD,1,1,1\n',
  'members.csv': 'member,start,end,section,material,group\nC1,A,B,COL,S355,columns\nB1,B,C,BM,S355,beams\nC2,D,C,COL,S355,columns\n',
  'cases.csv': 'case,category,title,self_weight,mass\nG,dead,Dead load,1,yes\nW,wind,Wind from the left,0,no\n',
  'member_loads.csv': 'case,member,kind,direction,w1\nG,B1,uniform,global_y,-20\n',
  'node_loads.csv': 'case,node,fx [kN]\nW,B,10\n',
  'combinations.csv': 'combination,case,factor,limit_state\nULS-1,G,1.35,strength\nULS-1,W,1.5,strength\nSLS-1,G,1,service\n',
};
