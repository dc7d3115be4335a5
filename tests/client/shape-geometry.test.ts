/** Mode and buckled shapes drawn along members: cubic between end translations with the slopes of the end rotations. */
import { describe, expect, it } from 'vitest';
import { curvedShapePositions } from '../../src/utils/shapeGeometry.js';
import type { RunGeometry } from '../../shared/schemas/runs.js';

const beam = (nodes: RunGeometry['nodes']): Pick<RunGeometry, 'nodes' | 'members'> => ({
  nodes,
  members: [{ id: 'M', start: 0, end: 1, ratio: null, status: 'not checked' }],
});

describe('shapes along members', () => {
  it('puts the ends at the node translations and is straight without rotations', () => {
    const g = beam([['A', 0, 0, 0], ['B', 4, 0, 0]]);
    const shape = [0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0];
    const p = curvedShapePositions(g, shape, 0.5, 4);
    expect(p.length).toBe(4 * 6);
    expect(Array.from(p.slice(0, 3))).toEqual([0, 0, 0]);
    expect(Array.from(p.slice(-3))).toEqual([4, 0.5, 0]);
    // no rotations: Hermite with zero slopes still gives the smooth step h3(ξ) = 3ξ² − 2ξ³; at ξ = 0.5 it is 0.5
    expect(p[1 * 6 + 4]).toBeCloseTo(0.5 * 0.5, 6); // float32 positions: 6 decimals
  });

  it('bends a simply supported beam by its end rotations (mid-span L·θ/4 for equal and opposite end rotations)', () => {
    const L = 6;
    const g = beam([['A', 0, 0, 0], ['B', L, 0, 0]]);
    // rotation about z of −θ at A and +θ at B: the sagging half-sine-like shape of a first mode
    const th = 0.1;
    const shape = [0, 0, 0, 0, 0, -th, 0, 0, 0, 0, 0, th];
    const p = curvedShapePositions(g, shape, 1, 2);
    // Hermite cubic at ξ = 1/2 (closed form): slopes r × x̂ are −θ at A and +θ at B along y, so
    // v = L·(1/8)·(−θ) − L·(1/8)·θ = −L·θ/4; float32 positions, 6 decimals
    expect(p[4]).toBeCloseTo(-L * th / 4, 6);
    expect(p[3]).toBeCloseTo(L / 2, 6);
  });

  it('keeps the axial part linear along the member', () => {
    const g = beam([['A', 0, 0, 0], ['B', 0, 3, 0]]);
    const shape = [0, 0, 0, 0, 0, 0, 0, 0.3, 0, 0, 0, 0];
    const p = curvedShapePositions(g, shape, 1, 3);
    // a third of the way: y = 1 m + 0.3/3 m (linear axial interpolation); float32, 6 decimals
    expect(p[4]).toBeCloseTo(1 + 0.1, 6);
    expect(p[3]).toBeCloseTo(0, 6);
  });
});
