/**
 * JSON shapes the hunt API answers with (shared by route handlers and the browser).
 * Dates travel as ISO strings.
 */
import type { Fix, NextSpot } from '@/lib/df';
import type { BearingRow, CaseStatus, Role } from '@/db/types';

export type PersonRef = { id: string; name: string; callSign: string | null };

export type ReportData = {
  sound?: string;
  soundNote?: string;
  frequenciesKhz?: number[];
  levelDbm?: number | null;
  schedule?: { days: string[]; fromHour?: number; toHour?: number; pattern: 'continuous' | 'intermittent'; note: string };
};

export type CaseDetail = {
  id: string;
  reference: string;
  title: string;
  description: string;
  status: CaseStatus;
  bands: string[];
  version: number;
  createdAt: string;
  updatedAt: string;
  report: ReportData;
  consentShareName: boolean;
  outcome: string | null;
  levelBeforeDbm: number | null;
  levelAfterDbm: number | null;
  resolvedAt: string | null;
  mergedInto: { id: string; reference: string } | null;
  assignee: PersonRef | null;
  /** Coordinators, admins and the assigned hunter only (and the reporter for themself). */
  reporter?: (PersonRef & { email: string }) | null;
  reportedPosition?: { lat: number; lon: number } | null;
  /** Coordinators and admins only: a likely duplicate filed within 500 m sharing a band. */
  possibleDuplicate?: { id: string; reference: string; title: string } | null;
  locateThresholdM: number;
  maxPositionAccuracyM: number;
  /** What the caller may do, as the server will enforce it. */
  can: {
    edit: boolean;
    assign: boolean;
    comment: boolean;
    hunt: boolean; // add and edit bearings and sweeps
    seeHunt: boolean; // read bearings and fixes
    merge: boolean;
    confirmPremises: boolean;
    transitions: CaseStatus[];
  };
  viewerRole: Role;
};

export type BearingView = Omit<BearingRow, 'authorId' | 'sweep' | 'takenAt' | 'createdAt' | 'updatedAt'> & {
  author: PersonRef | null;
  sweep: SweepRecord | null;
  revisions: number;
  takenAt: string;
  createdAt: string;
  updatedAt: string;
};

export type SweepRecord = {
  levelUnit: 'dBm' | 'S';
  samples: { azimuthDeg: number; level: number; levelDbm: number }[]; // azimuth as entered
  fit: { nullAzimuthDeg: number; sigmaDeg: number; nullDepthDb: number; rmsResidualDb: number };
};

export type FixSnapshotView = {
  id: string;
  createdAt: string;
  cause: string;
  lineCount: number;
  fix: Fix;
};

export type FixView = {
  current: FixSnapshotView | null;
  /** Earlier estimates, oldest first: how the fix converged. */
  trail: { id: string; createdAt: string; ok: boolean; lat: number | null; lon: number | null; semiMajorM: number | null; lineCount: number }[];
  nextSpots: NextSpot[];
  /** Plain-language warnings: loop size, near field, one-way lines pointing away, ... */
  warnings: string[];
  locateThresholdM: number;
  /** True when the current fix is good enough to move the case to located. */
  locatable: boolean;
};

export type EventView = {
  id: string;
  kind: string;
  data: Record<string, unknown>;
  visibility: 'all' | 'committee';
  actor: { id: string; name: string } | null;
  createdAt: string;
};
