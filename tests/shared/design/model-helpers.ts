/** A small model and a stand-in analysis result for orchestration tests (demo values). */
import type { Member, Model, Section, Settings } from '../../../shared/model/types.js';
import type { AnalysisResult, Loading, StationForces } from '../../../shared/engine/types.js';

export function settings(over: Partial<Settings> = {}): Settings {
  return { title: 't', units: 'metric', verticalAxis: 'Y', designCode: 'en1993-1-1', combinationRule: 'table', deflectionLimit: 360, gammaM0: 1, gammaM1: 1, gammaM2: 1.25, stations: 11, analysis: 'first_order', bucklingModes: 0, modes: 0, stabilityWarning: true, ...over };
}

export function member(id: string, start: string, end: string, section: string, over: Partial<Member> = {}): Member {
  return { id, start, end, section, material: 'S235', type: 'frame', roll: 0, releaseStart: 'fixed', releaseEnd: 'fixed', kMajor: 1, kMinor: 1, ...over };
}

export function model(sections: Section[], members: Member[], nodes: [string, number, number][], supported: string[], over: Partial<Settings> = {}): Model {
  return {
    settings: settings(over),
    inferred: { verticalAxisInferred: false, planeFrame: null, defaulted: [] },
    nodes: nodes.map(([id, x, y]) => ({ id, x, y, z: 0 })),
    supports: supported.map((node) => ({ node, restrained: [true, true, true, true, true, true], springs: [0, 0, 0, 0, 0, 0] })),
    materials: [{ id: 'S235', E: 210e9, G: 80.77e9, nu: 0.3, fy: 235e6, fu: 360e6, density: 7850, alpha: 1.2e-5 }],
    sections, members,
    cases: [{ id: 'D', category: 'dead', title: 'D', selfWeight: 0, mass: false }],
    nodeLoads: [], memberLoads: [], settlements: [], combinations: [], vehicles: [], lanes: [], movingLoads: [], resultPoints: [],
  };
}

/** An analysis stand-in: forces(member, loading) and displacements(loading) given as functions. */
export function analysis(m: Model, loadings: Loading[], forces: (mi: number, li: number) => StationForces, disp?: (li: number) => Float64Array): AnalysisResult {
  const nodeIds = m.nodes.map((n) => n.id);
  const len = m.members.map((mb) => {
    const a = m.nodes.find((n) => n.id === mb.start)!, b = m.nodes.find((n) => n.id === mb.end)!;
    return Math.hypot(b.x - a.x, b.y - a.y, b.z - a.z);
  });
  return {
    nodeIds, memberIds: m.members.map((mb) => mb.id), loadings,
    displacements: disp ?? (() => new Float64Array(nodeIds.length * 6)),
    reactions: () => new Float64Array(nodeIds.length * 6),
    supportedNodes: [],
    memberForces: forces,
    memberLength: (i) => len[i],
    diagnostics: { nodes: nodeIds.length, members: m.members.length, freedoms: 0, cases: 1, nnzK: 0, nnzFactor: 0, timings: {}, equilibrium: [] },
  };
}

export const loading = (id: string, kind: 'case' | 'combination', limitState: 'strength' | 'service' | null): Loading => ({ id, kind, limitState, terms: [] });
