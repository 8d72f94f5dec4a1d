import { NoticeBox } from '@/components/ui/notice-box';
import type { FormProblem } from '@/lib/api/use-api-form';

/** What useApiForm could not put on a field: the server's message, shown the same way by every form. */
export function FormProblemBox({ problem, title }: { problem: FormProblem | null; title?: string }) {
  if (!problem) return null;
  return (
    <NoticeBox tone={problem.status === 409 || problem.status === 429 ? 'warn' : 'error'} title={title}>
      {problem.message}
    </NoticeBox>
  );
}
