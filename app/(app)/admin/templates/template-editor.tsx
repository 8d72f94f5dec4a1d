'use client';

import { useMemo, useState } from 'react';
import { NoticeBox } from '@/components/ui/notice-box';
import { FieldError } from '@/components/ui/field-error';
import { FormProblemBox } from '@/components/ui/form-problem';
import { useApiForm } from '@/lib/api/use-api-form';
import { renderNotice, templateProblem, wrapHtml } from '@/lib/notices/render';
import { SAMPLE_VALUES } from '@/lib/notices/templates';
import { templatePutSchema } from '@/lib/validation/notices';

type Template = { key: string; title: string; subject: string; body: string; version: number };

const formValues = (t: Template) => ({ version: t.version, subject: t.subject, body: t.body });

/**
 * The letter texts (admin), on the one form hook: the handler's schema checks subject and text
 * in the browser, the server's issues (a placeholder problem) land on the field they name, and a
 * 409 (someone saved in between) shows with the form.
 */
export function TemplateEditor({ templates, placeholders }: { templates: Template[]; placeholders: Record<string, string> }) {
  const [all, setAll] = useState(templates);
  const [key, setKey] = useState(templates[0]?.key ?? '');
  const current = all.find((t) => t.key === key)!;
  const [withReporter, setWithReporter] = useState(false);
  const [saved, setSaved] = useState(false);
  const { form, submit, problem: serverProblem, setProblem, pending } = useApiForm<typeof templatePutSchema, Template>(templatePutSchema, {
    defaultValues: formValues(current),
    request: () => ({ url: `/api/templates/${key}`, method: 'PUT' }),
    onSuccess: (data) => {
      setAll(all.map((t) => (t.key === key ? { ...t, ...data } : t)));
      form.reset(formValues({ ...current, ...data }));
      setSaved(true);
    },
  });
  const { errors } = form.formState;
  const subject = form.watch('subject') ?? '';
  const body = form.watch('body') ?? '';

  const problem = templateProblem(subject) ?? templateProblem(body);
  const preview = useMemo(() => {
    if (problem) return null;
    const values = { ...SAMPLE_VALUES, reporterName: withReporter ? 'Dov Pellinger' : '' };
    const r = renderNotice({ subject, body }, values);
    return { ...r, html: wrapHtml(r.html, values.clubName ?? '') };
  }, [subject, body, problem, withReporter]);

  function choose(k: string) {
    const t = all.find((x) => x.key === k)!;
    setKey(k);
    form.reset(formValues(t));
    setProblem(null);
    setSaved(false);
  }

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <form
        className="card space-y-3"
        aria-label="Edit the letter"
        noValidate
        onSubmit={(e) => {
          setSaved(false);
          return submit(e);
        }}
      >
        <div>
          <label htmlFor="template-key" className="label">
            Letter
          </label>
          <select id="template-key" className="field" value={key} onChange={(e) => choose(e.target.value)}>
            {all.map((t) => (
              <option key={t.key} value={t.key}>
                {t.title}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="template-subject" className="label">
            Subject
          </label>
          <input
            id="template-subject"
            className="field"
            aria-invalid={!!errors.subject}
            aria-describedby={errors.subject ? 'template-subject-error' : undefined}
            {...form.register('subject')}
          />
          <FieldError id="template-subject-error" message={errors.subject?.message} />
        </div>
        <div>
          <label htmlFor="template-body" className="label">
            Text
          </label>
          <textarea
            id="template-body"
            rows={22}
            className="field font-mono text-sm"
            aria-invalid={!!errors.body}
            aria-describedby={errors.body ? 'template-help template-body-error' : 'template-help'}
            {...form.register('body')}
          />
          <FieldError id="template-body-error" message={errors.body?.message} />
          <p id="template-help" className="mt-1 text-sm text-ink-soft">
            A blank line starts a paragraph; lines starting with “- ” make a list. {'{{#personalNote}}…{{/personalNote}}'} shows its part only when there is a
            note.
          </p>
        </div>
        {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
        <FormProblemBox problem={serverProblem} />
        {saved && <NoticeBox tone="info">Saved. Notices approved from now on use this text.</NoticeBox>}
        <button type="submit" className="btn-primary" disabled={pending || !!problem}>
          Save letter
        </button>
        <details>
          <summary className="cursor-pointer font-semibold">Placeholders</summary>
          <dl className="mt-2 space-y-1 text-sm">
            {Object.entries(placeholders).map(([k, v]) => (
              <div key={k}>
                <dt className="inline font-mono">{`{{${k}}}`}</dt> <dd className="inline text-ink-soft">— {v}</dd>
              </div>
            ))}
          </dl>
        </details>
      </form>
      <div className="card space-y-2" aria-live="polite">
        <h2 className="text-xl font-bold">Live preview</h2>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={withReporter} onChange={(e) => setWithReporter(e.target.checked)} /> The reporter agreed to share their name
        </label>
        {preview && (
          <>
            <p className="text-sm">
              <span className="font-semibold">Subject:</span> {preview.subject}
            </p>
            <iframe title="Letter preview" sandbox="" srcDoc={preview.html} className="h-[32rem] w-full rounded border border-ink/10 bg-white" />
          </>
        )}
      </div>
    </div>
  );
}
