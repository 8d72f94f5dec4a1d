/** Row shapes as the app sees them (camelCase); db/ maps from snake_case columns. */
export const ROLES = ['admin', 'coordinator', 'hunter', 'member'] as const;
export type Role = (typeof ROLES)[number];

export const CASE_STATUSES = ['open', 'located', 'notified', 'resolved'] as const;
export type CaseStatus = (typeof CASE_STATUSES)[number];

export type User = {
  id: string;
  email: string;
  name: string;
  callSign: string | null;
  role: Role;
  active: boolean;
  createdAt: Date;
  updatedAt: Date;
};

export type ClubSettings = {
  clubName: string;
  contactEmail: string;
  locateThresholdM: number;
  reminderDays: number;
  maxPositionAccuracyM: number;
  /** ITU-R P.372 environment for the expected man-made noise floor */
  noiseEnvironment: 'city' | 'residential' | 'rural' | 'quiet-rural';
  uploadLimitMb: number;
};

export type Profile = {
  name: string;
  email: string;
  callSign: string | null;
  role: Role;
  loopShape: string | null;
  loopSizeM: number | null;
  loopCircumferenceM: number | null;
  sMeterOffsetDb: number;
  bearingReference: 'true' | 'magnetic';
};

export type BearingRow = {
  id: string;
  caseId: string;
  authorId: string | null;
  lat: number;
  lon: number;
  positionSource: 'device' | 'map';
  positionAccuracyM: number | null;
  azimuthEnteredDeg: number;
  reference: 'true' | 'magnetic';
  declinationDeg: number;
  azimuthTrueDeg: number;
  sigmaDeg: number;
  nullWidthDeg: number | null;
  frequencyKhz: number | null;
  oneWay: boolean;
  note: string;
  sweep: unknown;
  excluded: boolean;
  version: number;
  /** UUID made by the phone when the bearing was typed (a retried send finds this row) */
  clientId: string | null;
  takenAt: Date;
  createdAt: Date;
  updatedAt: Date;
};

export type CaseRow = {
  id: string;
  reference: string;
  title: string;
  description: string;
  status: CaseStatus;
  reporterId: string | null;
  assigneeId: string | null;
  reportedLat: number | null;
  reportedLon: number | null;
  bands: string[];
  version: number;
  createdAt: Date;
  updatedAt: Date;
  report: Record<string, unknown>;
  consentShareName: boolean;
  possibleDuplicateOf: string | null;
  mergedInto: string | null;
  outcome: string | null;
  levelBeforeDbm: number | null;
  levelAfterDbm: number | null;
  resolvedAt: Date | null;
};

export type CaseEvent = {
  id: string;
  caseId: string;
  actorId: string | null;
  kind: string;
  data: Record<string, unknown>;
  visibility: 'all' | 'committee';
  createdAt: Date;
};

/** One level reading of a walked level trail (the field screen's walk mode, or an imported GPX survey). */
export type LevelReadingRow = {
  id: string;
  caseId: string;
  authorId: string | null;
  clientId: string | null;
  source: 'walk' | 'gpx';
  lat: number;
  lon: number;
  /** stated position accuracy, metres */
  accuracyM: number | null;
  levelUnit: 'S' | 'dBm';
  /** as read (S-units continue past S9 at 6 dB each) */
  levelValue: number;
  /** at the receiver input, dBm, corrected by the hunter's S-meter offset */
  levelDbm: number;
  frequencyKhz: number | null;
  note: string;
  takenAt: Date;
  createdAt: Date;
};
