import { FormProblemBox } from '@/components/ui/form-problem';
import type { FormProblem } from '@/lib/api/use-api-form';

/** The frame every status change shares: heading, the server's answer, fields, confirm and cancel. */
export function TransitionFormShell({
  title,
  submitLabel,
  busy,
  problem,
  onSubmit,
  onCancel,
  children,
}: {
  title: string;
  submitLabel: string;
  busy: boolean;
  problem: FormProblem | null;
  onSubmit: (e?: React.BaseSyntheticEvent) => Promise<void>;
  onCancel: () => void;
  children: React.ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-lg border border-hush-500 bg-hush-50 p-3" aria-label={title}>
      <h3 className="font-bold">{title}</h3>
      <FormProblemBox problem={problem} />
      {children}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? 'Saving…' : submitLabel}
        </button>
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
