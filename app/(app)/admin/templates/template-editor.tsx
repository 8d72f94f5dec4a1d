'use client';

import { useMemo, useState } from 'react';
import { callApi } from '@/lib/api/client';
import { NoticeBox } from '@/components/ui/notice-box';
import { renderNotice, templateProblem, wrapHtml } from '@/lib/notices/render';
import { SAMPLE_VALUES } from '@/lib/notices/templates';

type Template = { key: string; title: string; subject: string; body: string; version: number };

export function TemplateEditor({ templates, placeholders }: { templates: Template[]; placeholders: Record<string, string> }) {
  const [all, setAll] = useState(templates);
  const [key, setKey] = useState(templates[0]?.key ?? '');
  const current = all.find((t) => t.key === key)!;
  const [subject, setSubject] = useState(current.subject);
  const [body, setBody] = useState(current.body);
  const [withReporter, setWithReporter] = useState(false);
  const [message, setMessage] = useState<{ tone: 'info' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

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
    setSubject(t.subject);
    setBody(t.body);
    setMessage(null);
  }

  async function save() {
    setBusy(true);
    const r = await callApi<Template>(`/api/templates/${key}`, { method: 'PUT', body: { version: current.version, subject, body } });
    setBusy(false);
    if (!r.ok) return setMessage({ tone: 'error', text: [r.error, ...(r.issues ?? []).map((i) => i.message)].join(' ') });
    setAll(all.map((t) => (t.key === key ? { ...t, ...r.data } : t)));
    setMessage({ tone: 'info', text: 'Saved. Notices approved from now on use this text.' });
  }

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <div className="card space-y-3">
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
          <input id="template-subject" className="field" value={subject} onChange={(e) => setSubject(e.target.value)} />
        </div>
        <div>
          <label htmlFor="template-body" className="label">
            Text
          </label>
          <textarea id="template-body" rows={22} className="field font-mono text-sm" value={body} onChange={(e) => setBody(e.target.value)} aria-describedby="template-help" />
          <p id="template-help" className="mt-1 text-sm text-ink-soft">
            A blank line starts a paragraph; lines starting with “- ” make a list. {'{{#personalNote}}…{{/personalNote}}'} shows its part only when there is a
            note.
          </p>
        </div>
        {problem && <NoticeBox tone="error">{problem}</NoticeBox>}
        {message && <NoticeBox tone={message.tone}>{message.text}</NoticeBox>}
        <button type="button" className="btn-primary" disabled={busy || !!problem} onClick={save}>
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
      </div>
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
