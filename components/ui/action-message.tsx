import { NoticeBox } from '@/components/ui/notice-box';
import type { ActionMessage } from '@/components/hunt/use-case-action';

/** The outcome of the last change, read out to screen readers (alert for errors, status otherwise). */
export function ActionMessageBox({ message }: { message: ActionMessage | null }) {
  if (!message) return null;
  return <NoticeBox tone={message.tone}>{message.text}</NoticeBox>;
}
