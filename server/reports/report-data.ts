/**
 * What the calculation package shows, gathered on the HTTP side from the stored run and the
 * worker pool, then handed (as plain JSON) to the report worker that lays out the PDF.
 * Values are SI; `units` says how to show them (the same conversions as the member page).
 */
import type { UnitSystem } from '../../shared/model/types.js';
import type { CheckRecord, MemberUtilisation } from '../../shared/design/types.js';
import type { Stations } from '../../shared/schemas/runs.js';

export interface ReportCover {
  project: string;
  model: string;
  version: number;
  run: number;
  designCode: string;
  /** 'first_order' | 'second_order' */
  analysis: string;
  method: string;
  units: UnitSystem;
  reviewStatus: string;
  ranBy: string;
  ranAt: string;
  /** review history, oldest first: "submitted by A on …" */
  review: { action: string; by: string; at: string; message: string }[];
  software: string;
  generatedAt: string;
  counts: { pass: number; fail: number; notChecked: number };
  maxRatio: number | null;
  /** which members have records: "failing members (3)", "all members (12)", "selected members (2)" */
  selection: string;
}

export interface ReportMember {
  util: MemberUtilisation;
  /** the loading the diagrams are drawn for (the governing combination) */
  loading: string;
  stations: Stations | null;
  records: CheckRecord[];
}

export interface ReportData {
  cover: ReportCover;
  inputCounts: [string, number][];
  settings: [string, string][];
  schedule: MemberUtilisation[];
  members: ReportMember[];
}
