/**
 * Runs: one analysis + design check of one model version, done by the worker pool.
 *
 *   POST /api/models/:id/runs                 StartRunInput → 202 Run (queued)
 *   GET  /api/models/:id/runs                 → RunSummary[] (newest first)
 *   GET  /api/runs/:id                        → Run (poll for status, phase, progress)
 *   GET  /api/runs/:id/members                → RunMembers (the utilisation grid)
 *   GET  /api/runs/:id/members?layout=table   → RunMembersTable (the same rows, column by column)
 *   GET  /api/runs/:id/members/:member[?loading=]   → MemberDetail
 *   GET  /api/runs/:id/model[?loading=]       → RunGeometry (the 3D picture)
 *   GET  /api/runs/compare?a=&b=              → RunComparison
 *   GET  /api/runs/:id/shapes?kind=mode|buckling&index=[&loading=]   → RunShape (mode or buckled shape)
 *   GET  /api/runs/:id/exports/:kind.:format  kind = utilisation | checks | displacements |
 *                                             reactions | forces | stability | modes;
 *                                             format = xlsx | csv
 *
 * Every number in these responses is SI (N, m, Pa, rad); `units` says how to show it
 * (shared/units `fromSI`). Ratios are plain numbers; null = not checked.
 */
import { z } from 'zod';
import { CHECK_FAMILIES, CHECK_STATUSES, type CheckFamily, type CheckStatus } from '../design/types.js';
import { DESIGN_CODES, type DesignCode } from '../model/types.js';

export const RUN_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export const RUN_PHASES = ['reading', 'assembling', 'factorising', 'solving', 'recovering', 'checking', 'saving'] as const;
export type RunPhase = (typeof RUN_PHASES)[number];

/** Review state; only `draft` exists until the review workflow lands. */
export const REVIEW_STATUSES = ['draft', 'submitted', 'returned', 'approved'] as const;
export type ReviewStatus = (typeof REVIEW_STATUSES)[number];

const designCodeSchema = z.enum(DESIGN_CODES as [DesignCode, ...DesignCode[]]);
const checkStatusSchema = z.enum(CHECK_STATUSES as [CheckStatus, ...CheckStatus[]]);
const familySchema = z.enum(CHECK_FAMILIES as [CheckFamily, ...CheckFamily[]]);

export const startRunSchema = z
  .object({
    /** default: the model's current version */
    version: z.number().int().min(1).optional(),
    /** default: the model's design_code setting */
    designCode: designCodeSchema.optional(),
  })
  .strict();
export type StartRunInput = z.input<typeof startRunSchema>;

export const runCountsSchema = z.object({ pass: z.number().int(), fail: z.number().int(), notChecked: z.number().int() });
export type RunCounts = z.infer<typeof runCountsSchema>;

export const runSummarySchema = z.object({
  id: z.number().int(),
  modelId: z.number().int(),
  version: z.number().int(),
  designCode: designCodeSchema,
  status: z.enum(RUN_STATUSES),
  reviewStatus: z.enum(REVIEW_STATUSES),
  /** the phase in progress (running) or the last one reached */
  phase: z.enum(RUN_PHASES).nullable(),
  /** 0..1 rough progress */
  progress: z.number(),
  message: z.string(),
  maxRatio: z.number().nullable(),
  counts: runCountsSchema.nullable(),
  /** the analysis order the run's settings asked for (settings `analysis`) */
  analysis: z.enum(['first_order', 'second_order']).optional(),
  /** milliseconds from start to finish; null until finished */
  durationMs: z.number().nullable(),
  createdBy: z.number().int().nullable(),
  createdByName: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type RunSummary = z.infer<typeof runSummarySchema>;

/**
 * The stability part of a run (shared/stability/types.ts StabilitySummary) as JSON: shapes
 * are served one at a time by GET /api/runs/:id/shapes; an infinite αcr (no compression
 * anywhere) is null.
 */
export const runStabilitySchema = z.object({
  analysis: z.enum(['first_order', 'second_order']),
  /** the method in words */
  method: z.string(),
  /** how the code rules were applied, what was checked (in words) */
  notes: z.array(z.string()),
  subdivisions: z.number().int().optional(),
  tolerance: z.number().optional(),
  secondOrder: z.array(
    z.object({
      loading: z.string(),
      iterations: z.number().int(),
      converged: z.boolean(),
      change: z.number(),
      amplification: z.number().optional(),
      additions: z.string().optional(),
    }),
  ),
  /** per strength loading: αcr ascending (null = no buckling), and how many buckled shapes were kept */
  critical: z.array(z.object({ loading: z.string(), alphaCr: z.array(z.number().nullable()), shapes: z.number().int() })),
  modes: z.array(
    z.object({
      mode: z.number().int(),
      /** Hz */
      frequency: z.number(),
      /** s */
      period: z.number(),
      /** effective modal mass ratios X, Y, Z (0–1) */
      massRatio: z.tuple([z.number(), z.number(), z.number()]),
    }),
  ),
  /** kg along X, Y, Z */
  totalMass: z.tuple([z.number(), z.number(), z.number()]).optional(),
  warnings: z.array(
    z.object({
      loading: z.string(),
      alphaCr: z.number().nullable(),
      /** 1 / (1 − 1/αcr); null when αcr ≤ 1 */
      amplifier: z.number().nullable(),
      reasons: z.array(z.string()),
      message: z.string(),
    }),
  ),
});
export type RunStability = z.infer<typeof runStabilitySchema>;

export const SHAPE_KINDS = ['mode', 'buckling'] as const;
export type ShapeKind = (typeof SHAPE_KINDS)[number];

/** GET /api/runs/:id/shapes: one mode shape or buckled shape, per node ux…rz, scaled to a largest translation of 1. */
export const runShapeSchema = z.object({
  runId: z.number().int(),
  kind: z.enum(SHAPE_KINDS),
  /** 1-based mode number */
  index: z.number().int(),
  /** buckling: the loading the shape belongs to ('' for natural modes) */
  loading: z.string(),
  /** what the shape is, in words ("mode 1: 2.41 Hz", "ULS-1 buckling mode 1: αcr = 8.3") */
  label: z.string(),
  displacements: z.array(z.number()),
});
export type RunShape = z.infer<typeof runShapeSchema>;

export const runSchema = runSummarySchema.extend({
  /** the model settings the run used */
  settings: z.record(z.string(), z.unknown()),
  /** milliseconds per phase */
  timings: z.record(z.string(), z.number()),
  diagnostics: z
    .object({ nodes: z.number(), members: z.number(), freedoms: z.number(), loadings: z.number(), maxEquilibriumResidual: z.number() })
    .nullable(),
  /** analysis order, αcr, modes and stability warnings; null until done (and for runs before them) */
  stability: runStabilitySchema.nullable(),
});
export type Run = z.infer<typeof runSchema>;

/** One row of the utilisation grid. */
export const memberRowSchema = z.object({
  member: z.string(),
  group: z.string(),
  section: z.string(),
  material: z.string(),
  /** m */
  length: z.number(),
  ratio: z.number().nullable(),
  check: z.string(),
  clause: z.string(),
  combination: z.string(),
  status: checkStatusSchema,
  families: z.record(z.string(), z.number().nullable()),
  familyStatus: z.record(z.string(), checkStatusSchema),
  warnings: z.array(z.string()),
  vehiclePosition: z.number().optional(),
  /** governing ratio of the same member in the previous done run of the model (null = none) */
  previousRatio: z.number().nullable(),
  /** section in that previous run, when different */
  previousSection: z.string().optional(),
});
export type MemberRow = z.infer<typeof memberRowSchema>;

export const runMembersSchema = z.object({
  runId: z.number().int(),
  previousRunId: z.number().int().nullable(),
  units: z.enum(['metric', 'us']),
  designCode: designCodeSchema,
  /** families that occur in this run, in display order */
  families: z.array(familySchema),
  counts: runCountsSchema,
  members: z.array(memberRowSchema),
});
export type RunMembers = z.infer<typeof runMembersSchema>;

/**
 * The grid's rows column by column (`?layout=table`), for runs of 100k+ members: no key
 * repeated per row, each text value other than the member id once in `strings` (the text
 * columns hold indices into it), numbers as they are (exactly the numbers of RunMembers).
 * `familyRatios[f][i]` is the member's ratio in family f, null for no ratio, false when the family
 * does not apply to it; `familyStatus[f][i]` is an index into `strings`, -1 when absent.
 * Fields most rows lack (warnings, vehicle position, previous section) sit in `extras` by row.
 */
const textColumn = z.array(z.number().int());
export const runMembersTableSchema = runMembersSchema.omit({ members: true }).extend({
  count: z.number().int(),
  strings: z.array(z.string()),
  member: z.array(z.string()),
  group: textColumn,
  section: textColumn,
  material: textColumn,
  check: textColumn,
  clause: textColumn,
  combination: textColumn,
  status: textColumn,
  length: z.array(z.number()),
  ratio: z.array(z.number().nullable()),
  previousRatio: z.array(z.number().nullable()),
  familyRatios: z.record(z.string(), z.array(z.union([z.number(), z.null(), z.literal(false)]))),
  familyStatus: z.record(z.string(), textColumn),
  extras: z.record(z.string(), z.object({ warnings: z.array(z.string()).optional(), vehiclePosition: z.number().optional(), previousSection: z.string().optional() })),
});
export type RunMembersTable = z.infer<typeof runMembersTableSchema>;
export const MEMBERS_LAYOUTS = ['rows', 'table'] as const;
export type MembersLayout = (typeof MEMBERS_LAYOUTS)[number];

/** A check record as JSON (shared/design/types.ts CheckRecord). */
export const checkRecordSchema = z.object({
  member: z.string(),
  family: familySchema,
  code: designCodeSchema,
  clause: z.string(),
  title: z.string(),
  equation: z.string(),
  inputs: z.array(z.object({ symbol: z.string(), name: z.string(), value: z.union([z.number(), z.string()]), quantity: z.string() })),
  capacity: z.number().nullable(),
  demand: z.number().nullable(),
  quantity: z.string(),
  combination: z.string(),
  x: z.number().nullable(),
  ratio: z.number().nullable(),
  status: checkStatusSchema,
  note: z.string().optional(),
  vehiclePosition: z.number().optional(),
  envelope: z.enum(['max', 'min']).optional(),
  /** the analysis the forces come from (the method in words) */
  analysis: z.string().optional(),
  /** first-order stability warning of a combination in which this member is in compression */
  stability: z.string().optional(),
});
export type CheckRecordJson = z.infer<typeof checkRecordSchema>;

export const loadingInfoSchema = z.object({
  id: z.string(),
  kind: z.enum(['case', 'combination']),
  limitState: z.enum(['strength', 'service']).nullable(),
  /** moving loads: the loading's max or min envelope (the same id appears twice) */
  envelope: z.enum(['max', 'min']).optional(),
});
export type LoadingInfo = z.infer<typeof loadingInfoSchema>;

/** Station diagrams (SI; local axes; d_* relative to the chord). */
export const stationsSchema = z.object({
  x: z.array(z.number()),
  N: z.array(z.number()),
  V_major: z.array(z.number()),
  V_minor: z.array(z.number()),
  T: z.array(z.number()),
  M_major: z.array(z.number()),
  M_minor: z.array(z.number()),
  d_major: z.array(z.number()),
  d_minor: z.array(z.number()),
});
export type Stations = z.infer<typeof stationsSchema>;

/** Moving loads on the member-detail screen (shared/moving/detail.ts), SI. */
export const memberMovingSchema = z.object({
  movingLoad: z.number().int(),
  vehicle: z.string(),
  lane: z.string(),
  laneLength: z.number(),
  key: z.string(),
  station: z.number().int(),
  x: z.number(),
  influence: z.object({ s: z.array(z.number()), value: z.array(z.number()) }),
  envelope: z.object({ x: z.array(z.number()), max: z.array(z.number()), min: z.array(z.number()) }),
  /** absolute max and min of each force over the member and every vehicle position (x and leading-axle position, SI) */
  extremes: z.array(z.object({
    key: z.string(),
    max: z.object({ value: z.number(), x: z.number(), lead: z.number().nullable(), direction: z.enum(['forward', 'backward']).nullable() }),
    min: z.object({ value: z.number(), x: z.number(), lead: z.number().nullable(), direction: z.enum(['forward', 'backward']).nullable() }),
  })).optional(),
});
export type MemberMoving = z.infer<typeof memberMovingSchema>;

export const memberDetailSchema = z.object({
  runId: z.number().int(),
  units: z.enum(['metric', 'us']),
  row: memberRowSchema,
  start: z.string(),
  end: z.string(),
  type: z.enum(['frame', 'truss']),
  loadings: z.array(loadingInfoSchema),
  /** the loading the diagrams are for */
  loading: z.string(),
  /** the governing combination ('' when none) */
  governing: z.string(),
  stations: stationsSchema,
  /** every check record of the governing combination */
  governingRecords: z.array(checkRecordSchema),
  /** every check record of the chosen loading (empty for a load case) */
  loadingRecords: z.array(checkRecordSchema),
  /** moving loads: influence line and envelope per moving load (absent without moving loads) */
  moving: z.array(memberMovingSchema).optional(),
  /** the analysis the diagrams come from (first or second order) and its method in words */
  analysis: z.enum(['first_order', 'second_order']).optional(),
  method: z.string().optional(),
});
export type MemberDetail = z.infer<typeof memberDetailSchema>;

export const runGeometrySchema = z.object({
  runId: z.number().int(),
  units: z.enum(['metric', 'us']),
  verticalAxis: z.enum(['Y', 'Z']),
  planeFrame: z.object({ plane: z.enum(['XY', 'XZ', 'YZ']), normal: z.enum(['X', 'Y', 'Z']) }).nullable(),
  loadings: z.array(loadingInfoSchema),
  loading: z.string(),
  /** [id, x, y, z] */
  nodes: z.array(z.tuple([z.string(), z.number(), z.number(), z.number()])),
  members: z.array(
    z.object({ id: z.string(), start: z.number().int(), end: z.number().int(), ratio: z.number().nullable(), status: checkStatusSchema }),
  ),
  /** node index and restrained freedoms ux..rz */
  supports: z.array(z.object({ node: z.number().int(), restrained: z.array(z.boolean()) })),
  /** loads of the chosen loading (factored for a combination) */
  nodeLoads: z.array(z.object({ node: z.number().int(), values: z.array(z.number()) })),
  memberLoads: z.array(
    z.object({ member: z.number().int(), kind: z.string(), direction: z.string(), a: z.number(), b: z.number(), w1: z.number(), w2: z.number() }),
  ),
  /** per node ux, uy, uz, rx, ry, rz of the chosen loading (flattened, m and rad) */
  displacements: z.array(z.number()),
  maxDisplacement: z.number(),
  /** moving loads (shared/moving/picture.ts): lanes, vehicles, which vehicle runs where; SI */
  moving: z.object({
    lanes: z.array(z.object({ lane: z.string(), length: z.number(), points: z.array(z.tuple([z.number(), z.number(), z.number()])), s: z.array(z.number()) })),
    vehicles: z.array(z.object({ vehicle: z.string(), axles: z.array(z.object({ offset: z.number(), load: z.number() })) })),
    movingLoads: z.array(z.object({ case: z.string(), vehicle: z.string(), lane: z.string() })),
  }).optional(),
});
export type RunGeometry = z.infer<typeof runGeometrySchema>;

export const runComparisonSchema = z.object({
  a: runSummarySchema,
  b: runSummarySchema,
  rows: z.array(
    z.object({
      member: z.string(),
      sectionA: z.string().nullable(),
      sectionB: z.string().nullable(),
      ratioA: z.number().nullable(),
      ratioB: z.number().nullable(),
      statusA: checkStatusSchema.nullable(),
      statusB: checkStatusSchema.nullable(),
      /** ratioB − ratioA when both exist */
      delta: z.number().nullable(),
    }),
  ),
});
export type RunComparison = z.infer<typeof runComparisonSchema>;

export const EXPORT_KINDS = ['utilisation', 'checks', 'displacements', 'reactions', 'forces'] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];
/** Stability exports (tables.md "Results exports"), served by server/runs. */
export const STABILITY_EXPORT_KINDS = ['stability', 'modes'] as const;
export type StabilityExportKind = (typeof STABILITY_EXPORT_KINDS)[number];
export const EXPORT_FORMATS = ['xlsx', 'csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];
