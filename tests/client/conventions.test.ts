/** The conventions help page's pure parts: which import problems link to which topic, units table, arrow geometry. */
import { describe, expect, it } from 'vitest';
import { arcPath, arrowHead, problemTopic, problemTopics, UNIT_ROWS, unitFor } from '../../src/utils/conventions.js';
import { breadcrumbsFor } from '../../src/utils/breadcrumbs.js';
import { SYSTEM_UNITS } from '../../shared/units/index.js';
import { problems } from '../shared/reader/helpers.js';

describe('import problems that concern the conventions', () => {
  it('links a member load without a direction, or with an unknown one, to load directions', () => {
    const missing = problems({ member_loads: 'case,member,kind,w1\nD,M2,uniform,-5\n' }).filter((p) => p.severity === 'error');
    expect(missing.map(problemTopic)).toEqual(['load-directions']);
    const bad = problems({ member_loads: 'case,member,kind,direction,w1\nD,M2,uniform,down,-5\n' }).filter((p) => p.severity === 'error');
    expect(bad.length).toBeGreaterThan(0);
    expect(new Set(bad.map(problemTopic))).toEqual(new Set(['load-directions']));
  });

  it('links an unknown or mismatched unit and a unit on w1 to units', () => {
    const list = problems({ nodes: 'node,x [kN],y [furlong]\nN1,0,0\nN2,0,4\nN3,6,4\nN4,6,0\n' }).filter((p) => p.table === 'nodes' && p.severity === 'error');
    expect(list.length).toBeGreaterThanOrEqual(2);
    expect(new Set(list.map(problemTopic))).toEqual(new Set(['units']));
    const w = problems({ member_loads: 'case,member,kind,direction,w1 [kN/m]\nD,M2,uniform,global_y,-5\n' }).filter((p) => p.severity === 'error');
    expect(w.map(problemTopic)).toContain('units');
  });

  it('links a bad vertical_axis setting to global axes and leaves unrelated problems alone', () => {
    const list = problems({ settings: 'key,value\nvertical_axis,W\n' }).filter((p) => p.severity === 'error');
    expect(list.map(problemTopic)).toEqual(['global-axes']);
    expect(problemTopic({ table: 'members', column: 'start', message: 'unknown node N9' })).toBeNull();
    expect(problemTopic({ table: 'members', column: 'roll', message: '"abc" is not a number' })).toBe('local-axes');
  });

  it('counts problems per topic in page order', () => {
    expect(problemTopics([
      { table: 'member_loads', column: 'direction', message: 'x' },
      { table: 'nodes', column: 'x', message: 'unknown unit [q]' },
      { table: 'member_loads', column: 'direction', message: 'y' },
    ])).toEqual([
      { topic: 'load-directions', title: 'Load directions', count: 2 },
      { topic: 'units', title: 'Units and header brackets', count: 1 },
    ]);
  });
});

describe('help page content', () => {
  it('lists every quantity of the unit systems with their own units', () => {
    const listed = UNIT_ROWS.map((r) => r.quantity).sort();
    const all = Object.keys(SYSTEM_UNITS.metric).filter((q) => q !== 'ratio' && q !== 'text').sort();
    expect(listed).toEqual(all);
    expect(unitFor('moment', 'us')).toBe('kip-ft');
    expect(unitFor('section_dim', 'metric')).toBe('mm');
  });

  it('has a breadcrumb', () => {
    expect(breadcrumbsFor({ routeName: 'conventions', params: {} }).map((c) => c.title)).toEqual(['Help', 'Axes, signs and units']);
  });
});

describe('drawing helpers', () => {
  it('puts the arrow tip at the end point and the base behind it, symmetric about the shaft', () => {
    // arrow along +x from (0,0) to (100,0): base 9 behind the tip, 7 wide (closed form)
    expect(arrowHead(0, 0, 100, 0)).toBe('100,0 91,3.5 91,-3.5');
    // pointing up the screen (−y)
    expect(arrowHead(0, 100, 0, 0, 10, 4)).toBe('0,0 2,10 -2,10');
  });

  it('draws a counterclockwise arc with sweep 0 and ends it at the final angle', () => {
    const a = arcPath(0, 0, 10, 0, 90);
    expect(a.d).toBe('M 10 0 A 10 10 0 0 0 0 -10');
    expect(a.end[0]).toBeCloseTo(0, 12);
    expect(a.end[1]).toBeCloseTo(-10, 12);
    expect(arcPath(0, 0, 10, 90, 0).d).toBe('M 0 -10 A 10 10 0 0 1 10 0');
  });
});
