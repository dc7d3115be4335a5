/**
 * From the validated model to the analysis mesh: node coordinates, one element per
 * prismatic member and several per tapered member (internal nodes appended after the
 * user's nodes), local axes, element properties and releases, and the freedom status of
 * every node freedom (free, support, plane frame, no stiffness).
 */
import type { Material, Model, Release, Section } from '../model/types.js';
import { localAxes } from './axes.js';
import type { EndReleases } from './element.js';
import { GAUSS3_T, GAUSS3_W } from './gauss.js';
import { type PropsAt, propsAlong } from './taper.js';

export const FREE = 0, SUPPORT = 1, PLANE = 2, NO_STIFFNESS = 3;

export interface MemberInfo {
  id: string;
  start: number;
  end: number;
  L: number;
  /** local axes, rows x, y, z */
  R: Float64Array;
  truss: boolean;
  releases: EndReleases;
  material: Material;
  props: PropsAt;
  tapered: boolean;
  firstElement: number;
  elementCount: number;
}

export interface Mesh {
  nUserNodes: number;
  nNodes: number;
  /** x, y, z per node */
  coords: Float64Array;
  /** node id per mesh node (internal nodes: `member@x`) */
  nodeNames: string[];
  members: MemberInfo[];
  nElements: number;
  elStart: Int32Array;
  elEnd: Int32Array;
  elMember: Int32Array;
  /** offset of the element start along its member */
  elX0: Float64Array;
  elL: Float64Array;
  /** EA, EIy, EIz, GJ, depth per element (5 each) */
  elProps: Float64Array;
  /** release flags per element: bit 0 startMajor, 1 startMinor, 2 endMajor, 3 endMinor */
  elRel: Uint8Array;
  /** status per node freedom (FREE, SUPPORT, PLANE, NO_STIFFNESS) */
  status: Uint8Array;
  springs: Float64Array;
  /** user nodes with a support or spring */
  supportedNodes: number[];
}

export interface MeshOptions {
  taperSegments: number;
  /**
   * sub-elements per prismatic frame member (internal nodes appended after the user's nodes);
   * default 1. Second-order and buckling analyses use several so that the geometric stiffness
   * captures P-δ (curvature between the member's ends).
   */
  subdivisions?: number;
}

function releaseBits(r: Release): [boolean, boolean] {
  switch (r) {
    case 'pinned': return [true, true];
    case 'pinned_major': return [true, false];
    case 'pinned_minor': return [false, true];
    default: return [false, false];
  }
}

export function elementReleases(bits: number): EndReleases {
  return { startMajor: (bits & 1) !== 0, startMinor: (bits & 2) !== 0, endMajor: (bits & 4) !== 0, endMinor: (bits & 8) !== 0 };
}

export function buildMesh(model: Model, opts: MeshOptions): Mesh {
  const nodeIndex = new Map<string, number>();
  model.nodes.forEach((n, i) => {
    if (nodeIndex.has(n.id)) throw new Error(`node ${n.id}: duplicate id`);
    nodeIndex.set(n.id, i);
  });
  const sections = new Map<string, Section>(model.sections.map((s) => [s.id, s]));
  const materials = new Map<string, Material>(model.materials.map((m) => [m.id, m]));
  const nUser = model.nodes.length;
  const coords: number[] = [];
  for (const n of model.nodes) coords.push(n.x, n.y, n.z);
  const names = model.nodes.map((n) => n.id);

  const members: MemberInfo[] = [];
  const elStart: number[] = [], elEnd: number[] = [], elMember: number[] = [];
  const elX0: number[] = [], elL: number[] = [], elProps: number[] = [], elRel: number[] = [];
  let nNodes = nUser;
  model.members.forEach((m, mi) => {
    const s = nodeIndex.get(m.start), e = nodeIndex.get(m.end);
    if (s === undefined) throw new Error(`member ${m.id}: start node ${m.start} does not exist`);
    if (e === undefined) throw new Error(`member ${m.id}: end node ${m.end} does not exist`);
    const sec0 = sections.get(m.section);
    if (!sec0) throw new Error(`member ${m.id}: section ${m.section} does not exist`);
    const sec1 = m.sectionEnd !== undefined ? sections.get(m.sectionEnd) : undefined;
    if (m.sectionEnd !== undefined && !sec1) throw new Error(`member ${m.id}: end section ${m.sectionEnd} does not exist`);
    const mat = materials.get(m.material);
    if (!mat) throw new Error(`member ${m.id}: material ${m.material} does not exist`);
    const p0 = [coords[3 * s], coords[3 * s + 1], coords[3 * s + 2]] as const;
    const p1 = [coords[3 * e], coords[3 * e + 1], coords[3 * e + 2]] as const;
    const L = Math.hypot(p1[0] - p0[0], p1[1] - p0[1], p1[2] - p0[2]);
    if (!(L > 0)) throw new Error(`member ${m.id}: start and end nodes coincide (zero length)`);
    const R = localAxes(p0, p1, m.roll, model.settings.verticalAxis);
    const truss = m.type === 'truss';
    const [sMaj, sMin] = truss ? [false, false] : releaseBits(m.releaseStart);
    const [eMaj, eMin] = truss ? [false, false] : releaseBits(m.releaseEnd);
    const props = propsAlong(sec0, sec1);
    const tapered = sec1 !== undefined && sec1 !== sec0;
    const count = tapered ? Math.max(1, opts.taperSegments) : truss ? 1 : Math.max(1, Math.floor(opts.subdivisions ?? 1));
    const info: MemberInfo = {
      id: m.id, start: s, end: e, L, R, truss,
      releases: { startMajor: sMaj, startMinor: sMin, endMajor: eMaj, endMinor: eMin },
      material: mat, props, tapered, firstElement: elStart.length, elementCount: count,
    };
    members.push(info);
    let prev = s;
    for (let k = 0; k < count; k++) {
      const t0 = k / count, t1 = (k + 1) / count;
      let next = e;
      if (k < count - 1) {
        next = nNodes++;
        for (let c = 0; c < 3; c++) coords.push(p0[c] + (p1[c] - p0[c]) * t1);
        names.push(`${m.id}@${(t1 * L).toPrecision(6)}`);
      }
      // equivalent uniform properties of the piece: harmonic means over 3 Gauss points
      // (exact flexibility of the piece under constant force / moment)
      let fA = 0, fIy = 0, fIz = 0, fJ = 0, dep = 0;
      if (tapered) {
        for (let g = 0; g < 3; g++) {
          const q = props(t0 + (t1 - t0) * GAUSS3_T[g]);
          const w = GAUSS3_W[g];
          fA += w / q.A; fIy += w / q.Iy; fIz += w / q.Iz; fJ += w / q.J; dep += w * q.depth;
        }
      } else {
        const q = props(0);
        fA = 1 / q.A; fIy = 1 / q.Iy; fIz = 1 / q.Iz; fJ = 1 / q.J; dep = q.depth;
      }
      elStart.push(prev); elEnd.push(next); elMember.push(mi);
      elX0.push(t0 * L); elL.push((t1 - t0) * L);
      elProps.push(mat.E / fA, mat.E / fIy, mat.E / fIz, mat.G / fJ, dep);
      let bits = 0;
      if (k === 0) bits |= (sMaj ? 1 : 0) | (sMin ? 2 : 0);
      if (k === count - 1) bits |= (eMaj ? 4 : 0) | (eMin ? 8 : 0);
      elRel.push(bits);
      prev = next;
    }
  });

  const status = new Uint8Array(nNodes * 6);
  const springs = new Float64Array(nNodes * 6);
  const supported = new Set<number>();
  for (const sp of model.supports) {
    const n = nodeIndex.get(sp.node);
    if (n === undefined) throw new Error(`support at node ${sp.node}: the node does not exist`);
    let any = false;
    for (let k = 0; k < 6; k++) {
      if (sp.restrained[k]) { status[n * 6 + k] = SUPPORT; any = true; }
      else if (sp.springs[k] !== 0) { springs[n * 6 + k] += sp.springs[k]; any = true; }
    }
    if (any) supported.add(n);
  }
  const pf = model.inferred.planeFrame;
  if (pf) {
    const nrm = pf.normal === 'X' ? 0 : pf.normal === 'Y' ? 1 : 2;
    const fix = [nrm, 3 + ((nrm + 1) % 3), 3 + ((nrm + 2) % 3)];
    for (let n = 0; n < nNodes; n++) for (const k of fix) if (status[n * 6 + k] === FREE) status[n * 6 + k] = PLANE;
  }
  return {
    nUserNodes: nUser, nNodes, coords: Float64Array.from(coords), nodeNames: names, members,
    nElements: elStart.length,
    elStart: Int32Array.from(elStart), elEnd: Int32Array.from(elEnd), elMember: Int32Array.from(elMember),
    elX0: Float64Array.from(elX0), elL: Float64Array.from(elL), elProps: Float64Array.from(elProps),
    elRel: Uint8Array.from(elRel), status, springs,
    supportedNodes: [...supported].sort((a, b) => a - b),
  };
}
