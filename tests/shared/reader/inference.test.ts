import { describe, expect, it } from 'vitest';
import { model } from './helpers.js';

describe('settings defaults and inferences', () => {
  it('infers Y up and an X–Y plane frame for a planar model in X–Y', () => {
    const m = model({ settings: null });
    expect(m.settings.verticalAxis).toBe('Y');
    expect(m.inferred.verticalAxisInferred).toBe(true);
    expect(m.inferred.planeFrame).toEqual({ plane: 'XY', normal: 'Z' });
    expect(m.settings.units).toBe('metric');
    expect(m.settings.designCode).toBe('none');
    expect(m.settings.combinationRule).toBe('table');
    expect(m.settings.deflectionLimit).toBe(360);
    // recommended partial factors, EN 1993-1-1 6.1(1) Note 2B
    expect([m.settings.gammaM0, m.settings.gammaM1, m.settings.gammaM2]).toEqual([1.0, 1.0, 1.25]);
    expect(m.inferred.defaulted).toContain('units');
  });

  it('infers Z up when a node has z ≠ 0, and an X–Z plane frame', () => {
    const m = model({ nodes: 'node,x,y,z\nN1,0,0,0\nN2,0,0,4\nN3,6,0,4\nN4,6,0,0\n' });
    expect(m.settings.verticalAxis).toBe('Z');
    expect(m.inferred.planeFrame).toEqual({ plane: 'XZ', normal: 'Y' });
  });

  it('keeps a given vertical axis and says it was not inferred', () => {
    const m = model({ settings: 'key,value\nvertical_axis,z\n' });
    expect(m.settings.verticalAxis).toBe('Z');
    expect(m.inferred.verticalAxisInferred).toBe(false);
    // nodes lie in X–Y, which does not contain Z: not a plane frame
    expect(m.inferred.planeFrame).toBeNull();
  });

  it('finds no plane frame for a 3D model', () => {
    const m = model({ nodes: 'node,x,y,z\nN1,0,0,0\nN2,0,4,0\nN3,6,4,2\nN4,6,0,2\n' });
    expect(m.inferred.planeFrame).toBeNull();
  });

  it('finds no plane frame when a support restrains an out-of-plane freedom explicitly', () => {
    const m = model({ supports: 'node,type,uz\nN1,pinned,1\nN4,pinned,\n' });
    expect(m.inferred.planeFrame).toBeNull();
  });

  it('reads support types and lets an explicit column override the type', () => {
    const m = model({ supports: 'node,type,ux,rz,k_uz\nN1,fixed,free,,\nN4,pinned,,1,\n' });
    expect(m.supports[0].restrained).toEqual([false, true, true, true, true, true]);
    expect(m.supports[1].restrained).toEqual([true, true, true, false, false, true]);
  });

  it('applies member defaults', () => {
    const m = model();
    expect(m.members[0]).toMatchObject({ type: 'frame', roll: 0, releaseStart: 'fixed', releaseEnd: 'fixed', kMajor: 1, kMinor: 1 });
    expect(m.members[0].lb).toBeUndefined();
    expect(m.members[0].cb).toBeUndefined();
  });

  it('uses the file name as the title when settings give none', async () => {
    const { readCsvFiles } = await import('../../../shared/reader/index.js');
    const r = readCsvFiles([{ name: 'nodes.csv', text: 'node,x,y\n1,0,0\n2,1,0\n' }, { name: 'supports.csv', text: 'node,type\n1,fixed\n' }, { name: 'members.csv', text: 'member,start,end,section,material\nA,1,2,HX,S\n' }, { name: 'sections.csv', text: 'section,shape,A,I_major\nHX,custom,100,1e6\n' }, { name: 'materials.csv', text: 'material,E\nS,200000\n' }], { fileName: 'shed' });
    expect(r.ok && r.model.settings.title).toBe('shed');
  });
});

describe('combinations', () => {
  const cases = 'case,category\nD,dead\nW,wind\nL,live\n';
  it('reads the long and the wide form into the same combinations', () => {
    const long = model({ cases, combinations: 'combination,case,factor,limit_state\nU1,D,1.35,\nU1,L,1.5,strength\nS1,D,1,service\nS1,W,1,\n' });
    const wide = model({ cases, combinations: 'combination,limit_state,D,L,W\nU1,,1.35,1.5,\nS1,service,1,,1\n' });
    expect(wide.combinations).toEqual(long.combinations.map((c) => ({ ...c, row: wide.combinations.find((w) => w.id === c.id)!.row })));
    expect(long.combinations.map((c) => [c.id, c.limitState, c.terms])).toEqual([
      ['U1', 'strength', [{ case: 'D', factor: 1.35 }, { case: 'L', factor: 1.5 }]],
      ['S1', 'service', [{ case: 'D', factor: 1 }, { case: 'W', factor: 1 }]],
    ]);
  });

  it('makes one strength combination per case with factor 1.0 when there is no table', () => {
    const m = model();
    expect(m.combinations.map((c) => [c.limitState, c.terms])).toEqual([
      ['strength', [{ case: 'D', factor: 1 }]],
      ['strength', [{ case: 'W', factor: 1 }]],
    ]);
    const ids = new Set(m.cases.map((c) => c.id));
    expect(m.combinations.every((c) => !ids.has(c.id))).toBe(true);
  });
});

describe('generated combinations', () => {
  const cases = 'case,category\nD,dead\nQ,live\nW,wind\n';
  it('builds the combinations of the rule from the case categories, each naming its source', () => {
    const m = model({ cases, settings: 'key,value\ncombination_rule,en1990-6.10\n' });
    expect(m.combinations.length).toBeGreaterThan(0);
    expect(m.combinations.every((c) => c.generated && (c.source ?? '').length > 0)).toBe(true);
    expect(m.combinations.some((c) => c.limitState === 'service')).toBe(true);
  });

  it('ignores a combinations table under a generating rule, with a warning', async () => {
    const { read } = await import('./helpers.js');
    const r = read({ cases, settings: 'key,value\ncombination_rule,asce7-lrfd\n', combinations: 'combination,case,factor\nU1,D,1.4\n' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.warnings.some((w) => w.table === 'combinations' && w.message.includes('ignored'))).toBe(true);
    expect(r.model.combinations.some((c) => c.id === 'U1')).toBe(false);
  });
});
