/** The background jobs, one queue (graphile-worker); the worker's task list is lib/jobs/tasks.ts. */
export const JOB = {
  /** deliver one outbox row: payload {outboxId} */
  deliverMail: 'deliver-mail',
  /** every minute (cron): follow-up drafts for unanswered notices (lib/notices/reminders.ts) */
  prepareReminders: 'prepare-reminders',
  /** the audio signature of an uploaded recording: payload {fileId} */
  analyseAudio: 'analyse-audio',
  /** a photo's thumbnail and its stripped copy: payload {fileId} */
  makeThumbnail: 'make-thumbnail',
  /** every hour (cron): delete uploads never completed within a day */
  cleanUploads: 'clean-uploads',
} as const;

export const outboxJobKey = (outboxId: string) => `outbox:${outboxId}`;
