/**
 * The demo projects say what their models are (issue 13): the descriptions in server/db/seed.ts
 * against the sample models of scripts/samples/ that server/models/model.seed.ts puts in them.
 * Geometry facts are read from the models' own tables.
 */
import { describe, expect, it } from 'vitest';
import { DEMO_PROJECT_DESCRIPTIONS } from '../../server/db/seed.js';
import { SAMPLES, type SampleModel, type Table } from '../../scripts/samples/models.js';
import { DESIGN_CODE_NAMES } from '../../shared/reader/settings-summary.js';
import type { DesignCode } from '../../shared/model/types.js';

const models = SAMPLES.map((f) => f());
const byName = (name: string): SampleModel => models.find((m) => m.name === name)!;
const setting = (m: SampleModel, key: string) => m.tables.settings.find((r) => r[0] === key)?.[1];
const column = (t: Table, name: string) => t.slice(1).map((r) => r[t[0].indexOf(name)]);
const extent = (m: SampleModel, axis: string) => {
  const v = column(m.tables.nodes, axis).map(Number);
  return Math.max(...v) - Math.min(...v);
};

describe('demo project descriptions', () => {
  it('name the design code and units of every model in each project', () => {
    for (const m of models) {
      const us = setting(m, 'units') === 'us';
      const text = us ? DEMO_PROJECT_DESCRIPTIONS.us : DEMO_PROJECT_DESCRIPTIONS.metric;
      expect(text, m.name).toContain(DESIGN_CODE_NAMES[setting(m, 'design_code') as DesignCode]);
      expect(text, m.name).toContain(us ? 'US units' : 'metric');
    }
  });

  it('give the footbridge its span, truss type and panels (30 m, Pratt, 10 × 3 m, 3.2 m deep)', () => {
    const m = byName('footbridge-truss');
    expect(extent(m, 'x')).toBe(30);
    expect(extent(m, 'z')).toBe(3.2);
    const verticals = column(m.tables.members, 'group').filter((g) => g === 'vertical').length / 2;
    expect(verticals + 1).toBe(10); // 9 verticals per truss: 10 panels
    expect(DEMO_PROJECT_DESCRIPTIONS.metric).toMatch(/30 m steel footbridge of two Pratt trusses \(10 panels of 3 m, 3\.2 m deep\)/);
    expect(DEMO_PROJECT_DESCRIPTIONS.metric).not.toMatch(/Warren|24 m/);
  });

  it('give the road bridge its span and the bridge partial factor γM1 the model sets', () => {
    const m = byName('road-bridge-truss');
    expect(extent(m, 'x')).toBe(48);
    expect(DEMO_PROJECT_DESCRIPTIONS.metric).toContain('48 m road bridge');
    expect(DEMO_PROJECT_DESCRIPTIONS.metric).toContain(`γM1 = ${Number(setting(m, 'gamma_m1')).toFixed(2)}`);
  });

  it('give the workshop frame its storeys and analysis order', () => {
    const m = byName('sway-moment-frame');
    expect(new Set(column(m.tables.nodes, 'z').filter((z) => Number(z) > 0)).size).toBe(3);
    expect(setting(m, 'analysis')).toBe('second_order');
    expect(DEMO_PROJECT_DESCRIPTIONS.metric).toContain('three-storey workshop moment frame analysed to second order');
  });

  it('describe the US model as the portal frame it is (two bays, pinned bases), not roof trusses', () => {
    const m = byName('portal-frame-building');
    expect(column(m.tables.supports, 'type').every((t) => t === 'pinned')).toBe(true);
    expect(column(m.tables.members, 'group').filter((g) => String(g).includes('column')).length).toBe(3); // 3 column lines: 2 bays
    expect(DEMO_PROJECT_DESCRIPTIONS.us).toMatch(/two-bay storage shed: a pitched portal frame/);
    expect(DEMO_PROJECT_DESCRIPTIONS.us).toContain('pinned bases');
    expect(DEMO_PROJECT_DESCRIPTIONS.us).not.toMatch(/truss/);
  });
});

describe('road bridge partial factors', () => {
  it('uses the bridge values of EN 1993-2 6.1 (1): γM0 = 1.00, γM1 = 1.10, γM2 = 1.25 (from memory)', () => {
    const m = byName('road-bridge-truss');
    expect([setting(m, 'gamma_m0'), setting(m, 'gamma_m1'), setting(m, 'gamma_m2')]).toEqual([1.0, 1.1, 1.25]);
  });
});
