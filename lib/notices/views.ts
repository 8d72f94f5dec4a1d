import type { NoticeListRow } from '@/db/notices';

/** A notice as the composer and the case's notices list show it. */
export type NoticeView = {
  id: string;
  caseId: string;
  templateKey: string;
  status: string;
  /** plain words for the status, e.g. "waiting to send" */
  statusLabel: string;
  recipientName: string;
  postalAddress: string;
  email: string | null;
  personalNote: string;
  version: number;
  createdAt: string;
  createdByName: string | null;
  approvedByName: string | null;
  approvedAt: string | null;
  sentAt: string | null;
  deliveredOn: string | null;
  followUpOf: string | null;
  answers: number;
  delivery: { attempts: number; lastError: string | null; nextAttemptAt: string | null } | null;
};

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());

export function statusLabel(status: string, outboxStatus: string | null): string {
  switch (status) {
    case 'draft':
      return 'draft';
    case 'approved':
      return 'approved, not sent';
    case 'queued':
      return outboxStatus === 'sent' ? 'sent' : 'waiting to send';
    case 'sent':
      return 'sent';
    case 'failed':
      return 'sending failed';
    case 'hand-delivered':
      return 'delivered by hand';
    default:
      return status;
  }
}

export function toNoticeView(n: NoticeListRow): NoticeView {
  return {
    id: n.id,
    caseId: n.caseId,
    templateKey: n.templateKey,
    status: n.status,
    statusLabel: statusLabel(n.status, n.outboxStatus),
    recipientName: n.recipientName,
    postalAddress: n.postalAddress,
    email: n.email,
    personalNote: n.personalNote,
    version: n.version,
    createdAt: iso(n.createdAt)!,
    createdByName: n.createdByName,
    approvedByName: n.approvedByName,
    approvedAt: iso(n.approvedAt),
    sentAt: iso(n.sentAt),
    deliveredOn: n.deliveredOn,
    followUpOf: n.followUpOf,
    answers: Number(n.answers),
    delivery: n.outboxStatus
      ? { attempts: Number(n.attempts ?? 0), lastError: n.lastError, nextAttemptAt: iso(n.nextAttemptAt) }
      : null,
  };
}
