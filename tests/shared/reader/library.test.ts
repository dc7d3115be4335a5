import { describe, expect, it } from 'vitest';
import { catalogueSection, sectionProperties } from '../../../shared/sections/index.js';
import { builtInMaterial } from '../../../shared/materials/index.js';
import { errors, model } from './helpers.js';

describe('sections and materials', () => {
  it('uses a catalogue designation and a built-in material without defining them', () => {
    const m = model({
      members: 'member,start,end,section,material\nM1,N1,N2,HEB200,S355\nM2,N2,N3,IPE300,STEEL\nM3,N3,N4,HEB200,S355\n',
    });
    const heb = m.sections.find((s) => s.id === 'HEB200')!;
    expect(heb.builtIn).toBe(true);
    expect(heb.props).toEqual(catalogueSection('HEB200')!.props);
    const s355 = m.materials.find((x) => x.id === 'S355')!;
    expect(s355.builtIn).toBe(true);
    expect(s355.fy).toBe(builtInMaterial('S355')!.fy);
  });

  it('lets a section defined in the workbook override a catalogue section of the same name', () => {
    const m = model({
      sections: 'section,shape,A,I_major,I_minor,J\nIPE300,custom,1234,8e7,2e7,3e5\n',
      members: 'member,start,end,section,material\nM1,N1,N2,IPE300,STEEL\nM2,N2,N3,IPE300,STEEL\nM3,N3,N4,IPE300,STEEL\n',
    });
    expect(m.sections).toHaveLength(1);
    expect(m.sections[0].props.A).toBeCloseTo(1234e-6, 15);
    expect(m.sections[0].builtIn).toBeUndefined();
  });

  it('computes a dimensioned shape and lets a given property override the computed one', () => {
    const m = model({
      sections: 'section,shape,h,b,t,J [cm4]\nC1,rhs,200,100,8,1000\n',
    });
    const s = m.sections[0];
    const computed = sectionProperties('rhs', { h: 0.2, b: 0.1, t: 0.008 });
    expect(s.props.A).toBe(computed.A);
    expect(s.props.J).toBeCloseTo(1000e-8, 15);
    expect(s.given).toEqual(['J']);
    expect(s.dims).toEqual({ h: 0.2, b: 0.1, t: 0.008 });
  });

  it('reads D of a circular hollow section from a column written D or d', () => {
    const m = model({ sections: 'section,shape,D,t\nC1,chs,168.3,8\n' });
    expect(m.sections[0].dims).toEqual({ D: 0.1683, t: 0.008 });
  });

  it('reports an impossible wall thickness with the section row and column', () => {
    // t ≥ b/2 leaves no hole: the section validator refuses it
    const list = errors({ sections: 'section,shape,h,b,t\nC1,rhs,200,100,60\n' });
    expect(list.some((p) => p.table === 'sections' && p.row === 2 && p.column === 't')).toBe(true);
  });

  it('requires A and I_major of a custom section used by a frame member in a plane frame', () => {
    const list = errors({ sections: 'section,shape,A\nC1,custom,5000\n' });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ table: 'sections', row: 2, column: 'I_major' });
  });
});
