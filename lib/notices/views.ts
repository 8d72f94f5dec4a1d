import type { NoticeListRow } from '@/db/notices';
import type { EventView } from '@/lib/hunt/views';

/**
 * A notice as the assigned hunter may see it: that it exists, what kind it is and how it is
 * getting on. Nothing about the household (name, address, e-mail, note, answers, the mail
 * server's words, which may quote the address) and never the response link.
 */
export type NoticeSummary = {
  id: string;
  caseId: string;
  templateKey: string;
  status: string;
  /** plain words for the status, e.g. "waiting to send" */
  statusLabel: string;
  version: number;
  createdAt: string;
  createdByName: string | null;
  approvedByName: string | null;
  approvedAt: string | null;
  sentAt: string | null;
  deliveredOn: string | null;
  followUpOf: string | null;
};

/** A notice as the committee (coordinators, admins) sees it in the composer and the list. */
export type NoticeView = NoticeSummary & {
  recipientName: string;
  postalAddress: string;
  email: string | null;
  personalNote: string;
  answers: number;
  delivery: { attempts: number; lastError: string | null; nextAttemptAt: string | null } | null;
};

/** What a notices answer carries: the full view for the committee, the summary otherwise. */
export type NoticeItem = NoticeSummary | NoticeView;
export const hasContact = (n: NoticeItem): n is NoticeView => 'postalAddress' in n;

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

export function toNoticeSummary(n: NoticeListRow): NoticeSummary {
  return {
    id: n.id,
    caseId: n.caseId,
    templateKey: n.templateKey,
    status: n.status,
    statusLabel: statusLabel(n.status, n.outboxStatus),
    version: n.version,
    createdAt: iso(n.createdAt)!,
    createdByName: n.createdByName,
    approvedByName: n.approvedByName,
    approvedAt: iso(n.approvedAt),
    sentAt: iso(n.sentAt),
    deliveredOn: n.deliveredOn,
    followUpOf: n.followUpOf,
  };
}

export function toNoticeView(n: NoticeListRow): NoticeView {
  return {
    ...toNoticeSummary(n),
    recipientName: n.recipientName,
    postalAddress: n.postalAddress,
    email: n.email,
    personalNote: n.personalNote,
    answers: Number(n.answers),
    delivery: n.outboxStatus
      ? { attempts: Number(n.attempts ?? 0), lastError: n.lastError, nextAttemptAt: iso(n.nextAttemptAt) }
      : null,
  };
}

/** The one choice between the two shapes: `contact` is noticeAccess(...).contact. */
export const toNoticeItem = (n: NoticeListRow, contact: boolean): NoticeItem => (contact ? toNoticeView(n) : toNoticeSummary(n));

/** What a recipient's answer says beyond its kind: for the committee only (the name, their words, how to reach them). */
const RECIPIENT_KEYS = ['recipientName', 'text', 'contact'];

/** A timeline entry as someone outside the committee may read it: a recipient's answer keeps only its kind. */
export function withoutRecipientDetails(e: EventView): EventView {
  if (e.kind !== 'recipient-answered') return e;
  return { ...e, data: Object.fromEntries(Object.entries(e.data).filter(([k]) => !RECIPIENT_KEYS.includes(k))) };
}
