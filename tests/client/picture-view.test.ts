/**
 * The model picture's view set-up (src/utils/pictureView.ts, pictureGeometry.ts), checked with
 * three.js's own camera: +x lands right of the origin on screen for every plane frame (the
 * XZ frame used to be drawn mirrored), the fit keeps every node inside the view, the axis
 * triad, support symbols, the loading the picture opens on, the default deflection scale
 * and label placement.
 */
import { describe, expect, it } from 'vitest';
import * as THREE from 'three';
import { defaultDeflectionScale, modelExtent, viewDirection } from '../../src/utils/pictureGeometry.js';
import {
  boxCorners, cameraAxes, fitDistance, governingLoading, placeLabel, supportKind, triadDirections, type Vec3,
} from '../../src/utils/pictureView.js';
import type { RunGeometry } from '../../shared/schemas/runs.js';
import { project } from '../../src/components/model/sketch.js';

/** A camera set up as ModelPicture.vue does it: at centre + dir × distance, looking at the centre. */
function cameraFor(verticalAxis: 'Y' | 'Z', normal: 'X' | 'Y' | 'Z' | null, nodes: RunGeometry['nodes'], aspect = 2): THREE.PerspectiveCamera {
  const ext = modelExtent(nodes);
  const view = viewDirection(verticalAxis, normal);
  const camera = new THREE.PerspectiveCamera(40, aspect, 0.01, 1e4);
  camera.up.set(...view.up);
  const dir = new THREE.Vector3(...view.dir).normalize();
  const d = fitDistance(boxCorners(nodes), ext.center, view.dir, view.up, 40, aspect);
  camera.position.set(...ext.center).addScaledVector(dir, d);
  camera.lookAt(...ext.center);
  camera.updateMatrixWorld();
  camera.updateProjectionMatrix();
  return camera;
}
const onScreen = (camera: THREE.Camera, p: Vec3) => new THREE.Vector3(...p).project(camera);

describe('the view of a plane frame is not mirrored', () => {
  // a 48 m span in each plane (the road-bridge sample is an XZ frame with Z up)
  const cases: { name: string; vertical: 'Y' | 'Z'; normal: 'X' | 'Y' | 'Z'; along: Vec3; upAxis: Vec3 }[] = [
    { name: 'XZ frame, Z up (seen from −Y)', vertical: 'Z', normal: 'Y', along: [1, 0, 0], upAxis: [0, 0, 1] },
    { name: 'XY frame, Y up', vertical: 'Y', normal: 'Z', along: [1, 0, 0], upAxis: [0, 1, 0] },
    { name: 'YZ frame, Z up', vertical: 'Z', normal: 'X', along: [0, 1, 0], upAxis: [0, 0, 1] },
    { name: 'YZ frame, Y up (horizontal axis Z)', vertical: 'Y', normal: 'X', along: [0, 0, 1], upAxis: [0, 1, 0] },
  ];
  for (const c of cases) {
    it(`${c.name}: the positive horizontal axis runs right and the vertical axis up`, () => {
      const nodes: RunGeometry['nodes'] = [['A', 0, 0, 0], ['B', 48 * c.along[0], 48 * c.along[1], 48 * c.along[2]], ['C', 8 * c.upAxis[0], 8 * c.upAxis[1], 8 * c.upAxis[2]]];
      const camera = cameraFor(c.vertical, c.normal, nodes);
      const origin = onScreen(camera, [0, 0, 0]);
      const far = onScreen(camera, [48 * c.along[0], 48 * c.along[1], 48 * c.along[2]]);
      const top = onScreen(camera, [8 * c.upAxis[0], 8 * c.upAxis[1], 8 * c.upAxis[2]]);
      expect(far.x).toBeGreaterThan(origin.x); // NDC x grows to the right
      expect(top.y).toBeGreaterThan(origin.y); // NDC y grows upwards
    });
  }
  it('a floor plan (normal = vertical axis) keeps +X to the right', () => {
    for (const vertical of ['Y', 'Z'] as const) {
      const camera = cameraFor(vertical, vertical, [['A', 0, 0, 0], ['B', 10, 0, 0], ['C', 0, vertical === 'Z' ? 5 : 0, vertical === 'Y' ? 5 : 0]]);
      expect(onScreen(camera, [10, 0, 0]).x).toBeGreaterThan(onScreen(camera, [0, 0, 0]).x);
    }
  });
  it('a 3D model from a corner also has +X towards the right and the vertical axis up', () => {
    const nodes: RunGeometry['nodes'] = [['A', 0, 0, 0], ['B', 10, 0, 0], ['C', 0, 10, 0], ['D', 0, 0, 10]];
    for (const vertical of ['Y', 'Z'] as const) {
      const camera = cameraFor(vertical, null, nodes);
      expect(onScreen(camera, [10, 0, 0]).x).toBeGreaterThan(onScreen(camera, [0, 0, 0]).x);
      const up: Vec3 = vertical === 'Y' ? [0, 10, 0] : [0, 0, 10];
      expect(onScreen(camera, up).y).toBeGreaterThan(onScreen(camera, [0, 0, 0]).y);
    }
  });
  it('cameraAxes matches three.js lookAt (right = up × back)', () => {
    const view = viewDirection('Z', 'Y');
    const camera = new THREE.PerspectiveCamera();
    camera.up.set(...view.up);
    camera.position.set(...view.dir);
    camera.lookAt(0, 0, 0);
    camera.updateMatrixWorld();
    const right = new THREE.Vector3().setFromMatrixColumn(camera.matrixWorld, 0);
    const ax = cameraAxes(view.dir, view.up);
    expect(right.x).toBeCloseTo(ax.right[0], 12);
    expect(right.y).toBeCloseTo(ax.right[1], 12);
    expect(right.z).toBeCloseTo(ax.right[2], 12);
    expect(ax.right.map((v) => v + 0)).toEqual([1, 0, 0]);
  });
});

describe('the pre-run sketch is not mirrored either', () => {
  it('projects +x to the right (screen x grows) and up to the top (screen y runs down) in every plane', () => {
    expect(project([10, 0, 0], 'XZ', 'Z')[0]).toBeGreaterThan(project([0, 0, 0], 'XZ', 'Z')[0]);
    expect(project([0, 0, 5], 'XZ', 'Z')[1]).toBeLessThan(project([0, 0, 0], 'XZ', 'Z')[1]);
    expect(project([10, 0, 0], 'XY', 'Y')[0]).toBeGreaterThan(0);
    expect(project([0, 10, 0], 'YZ', 'Z')[0]).toBeGreaterThan(0);
    expect(project([10, 0, 0], null, 'Z')[0]).toBeGreaterThan(0);
  });
});

describe('fit to view', () => {
  it('grows the box by a pad on every side (room for load arrows and support symbols)', () => {
    const c = boxCorners([['A', 0, 0, 0], ['B', 10, 0, 4]], 1);
    expect(Math.min(...c.map((p) => p[0]))).toBe(-1);
    expect(Math.max(...c.map((p) => p[2]))).toBe(5);
  });
  it('puts every corner of the model inside the view, and fills most of it', () => {
    const nodes: RunGeometry['nodes'] = [['A', 0, 0, 0], ['B', 48, 0, 0], ['C', 6, 0, 8], ['D', 42, 0, 8]];
    for (const aspect of [0.6, 1, 2.1]) {
      const camera = cameraFor('Z', 'Y', nodes, aspect);
      const ndc = boxCorners(nodes).map((p) => onScreen(camera, p));
      for (const q of ndc) {
        expect(Math.abs(q.x)).toBeLessThanOrEqual(1);
        expect(Math.abs(q.y)).toBeLessThanOrEqual(1);
      }
      // the fit is tight along one screen direction: at most the 12 % margin spare
      const used = Math.max(...ndc.map((q) => Math.max(Math.abs(q.x), Math.abs(q.y))));
      expect(used).toBeGreaterThan(0.85);
    }
  });
  it('fits a 3D model seen from a corner', () => {
    const nodes: RunGeometry['nodes'] = [['A', 0, 0, 0], ['B', 12, 0, 0], ['C', 12, 5, 0], ['D', 0, 5, 6]];
    const camera = cameraFor('Z', null, nodes, 1.6);
    for (const p of boxCorners(nodes)) {
      const q = onScreen(camera, p);
      expect(Math.abs(q.x)).toBeLessThanOrEqual(1);
      expect(Math.abs(q.y)).toBeLessThanOrEqual(1);
      expect(q.z).toBeLessThan(1); // in front of the camera, inside the far plane
    }
  });
});

describe('axis triad', () => {
  it('for an XZ frame seen from −Y: X to the right, Z up, Y into the screen (zero length)', () => {
    const ax = cameraAxes([0, -1, 0], [0, 0, 1]);
    const t = triadDirections(ax.right, ax.up);
    expect(t.find((a) => a.axis === 'X')).toMatchObject({ x: 1 });
    expect(t.find((a) => a.axis === 'Z')?.y).toBe(-1); // screen y runs down
    const y = t.find((a) => a.axis === 'Y')!;
    expect(Math.hypot(y.x, y.y)).toBeCloseTo(0, 12);
  });
});

describe('support symbols', () => {
  const T = true;
  const F = false;
  it('a plane frame counts its in-plane freedoms only', () => {
    // road-bridge sample (XZ, normal Y): L0 holds ux, uz → pinned; L8 holds uz → roller
    expect(supportKind([T, F, T, F, F, F], 'Y')).toBe('pinned');
    expect(supportKind([F, F, T, F, F, F], 'Y')).toBe('roller');
    expect(supportKind([T, F, T, F, T, F], 'Y')).toBe('fixed');
    // XY frame (normal Z): rotation about Z decides
    expect(supportKind([T, T, F, F, F, T], 'Z')).toBe('fixed');
    expect(supportKind([T, T, T, T, T, F], 'Z')).toBe('pinned');
  });
  it('a 3D model counts all six', () => {
    expect(supportKind([T, T, T, T, T, T], null)).toBe('fixed');
    expect(supportKind([T, T, T, F, F, T], null)).toBe('pinned');
    expect(supportKind([F, T, T, F, F, F], null)).toBe('roller');
  });
});

describe('the loading the picture opens on', () => {
  const loadings = [{ id: 'G' }, { id: 'ULS-1' }, { id: 'ULS-2' }, { id: 'ULS-T', envelope: 'max' as const }, { id: 'ULS-T', envelope: 'min' as const }];
  it('is the combination governing the member with the largest ratio, not the first loading', () => {
    const rows = [{ ratio: 0.5, combination: 'ULS-1' }, { ratio: 0.6, combination: 'ULS-1' }, { ratio: 0.9, combination: 'ULS-2' }];
    expect(governingLoading(rows, loadings)).toBe('ULS-2');
  });
  it('names a moving-load envelope by its select value', () => {
    expect(governingLoading([{ ratio: 1.1, combination: 'ULS-T@min' }], loadings)).toBe('ULS-T@min');
    expect(governingLoading([{ ratio: 1.1, combination: 'ULS-T' }], loadings)).toBe('ULS-T@max');
  });
  it('without ratios, the combination governing the most members; null when nothing matches', () => {
    expect(governingLoading([{ ratio: null, combination: 'ULS-1' }, { ratio: null, combination: 'ULS-2' }, { ratio: null, combination: 'ULS-2' }], loadings)).toBe('ULS-2');
    expect(governingLoading([{ ratio: 0.4, combination: '' }], loadings)).toBeNull();
    expect(governingLoading(null, loadings)).toBeNull();
  });
});

describe('default deflection scale', () => {
  it('draws the largest displacement at about 5 % of the model size (common practice for a readable deflected shape)', () => {
    // 48 m model, 24 mm largest displacement: 0.05 × 48 / 0.024 = 100 exactly
    expect(defaultDeflectionScale(0.024, 48)).toBe(100);
    // rounded down to 1, 2 or 5 × 10^n: the drawn size stays between 2 % and 5 % of the model
    for (const [d, size] of [[0.0137, 30], [0.2, 9], [3e-5, 120], [0.5, 4]] as const) {
      const s = defaultDeflectionScale(d, size);
      const drawn = (s * d) / size;
      expect(drawn).toBeLessThanOrEqual(0.05 + 1e-12);
      expect(drawn).toBeGreaterThanOrEqual(0.02);
      expect(s / Math.pow(10, Math.floor(Math.log10(s)))).toSatisfy((m: number) => [1, 2, 5].some((k) => Math.abs(m - k) < 1e-9));
    }
    expect(defaultDeflectionScale(0, 12)).toBe(1);
  });
});

describe('labels stay inside the canvas', () => {
  it('moves a label at an edge back in, with a pad', () => {
    expect(placeLabel(995, 300, 60, 16, 1000, 500)).toEqual({ left: 1000 - 60 - 4, top: 292 });
    expect(placeLabel(-30, -5, 60, 16, 1000, 500)).toEqual({ left: 4, top: 4 });
    expect(placeLabel(500, 499, 60, 16, 1000, 500)).toEqual({ left: 506, top: 500 - 16 - 4 });
  });
});
