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
};

export type CaseEvent = {
  id: string;
  caseId: string;
  actorId: string | null;
  kind: string;
  data: Record<string, unknown>;
  createdAt: Date;
};
