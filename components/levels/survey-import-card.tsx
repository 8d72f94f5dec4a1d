'use client';

import Link from 'next/link';
import { useEffect, useRef, useState } from 'react';
import { FormProvider } from 'react-hook-form';
import { useSWRConfig } from 'swr';
import { useApiForm } from '@/lib/api/use-api-form';
import type { SurveySummary } from '@/lib/hunt/readings';
import type { SurveyProblem } from '@/lib/survey/walked-survey';
import { surveyImportSchema } from '@/lib/validation/readings';
import { formatLatLon } from '@/components/hunt/format-position';
import { FrequencyField } from '@/components/hunt/frequency-field';
import { levelLabel } from '@/components/field/level-words';
import { FieldError } from '@/components/ui/field-error';
import { FormProblemBox } from '@/components/ui/form-problem';
import { NumberField } from '@/components/ui/form-fields';
import { NoticeBox } from '@/components/ui/notice-box';

type Preview = { dryRun: true; ok: boolean; problems: SurveyProblem[]; problemCount: number } & Partial<SurveySummary>;
type Imported = { imported: number } & SurveySummary;

const when = (iso: string) => new Date(iso).toLocaleString([], { dateStyle: 'medium', timeStyle: 'medium' });
const dbm = (x: number) => `${Math.round(x * 10) / 10} dBm`;

/** Every problem the server named (GPX line, CSV row), in its own words. */
function ProblemList({ problems, count }: { problems: SurveyProblem[]; count: number }) {
  return (
    <ul className="list-disc space-y-0.5 pl-5" data-testid="survey-problems">
      {problems.map((p, i) => (
        <li key={i}>{p.message}</li>
      ))}
      {count > problems.length && <li>…and {count - problems.length} more.</li>}
    </ul>
  );
}

/** A labelled file input (a large tap target) with its error tied to it. */
function FileChoice({ id, label, accept, error, onFile }: { id: string; label: string; accept: string; error?: string; onFile: (f: File | undefined) => void }) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input
        id={id}
        type="file"
        accept={accept}
        className="field min-h-12 w-full"
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => onFile(e.target.files?.[0])}
      />
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

/** What the files would add, in words: points, time span, the strongest reading and the smoothed peak. */
function SurveyFacts({ s }: { s: Partial<SurveySummary> }) {
  return (
    <ul className="space-y-0.5">
      <li>
        <span className="font-semibold">{s.points}</span> {s.points === 1 ? 'point' : 'points'}
        {s.span && (
          <>
            {' '}
            from {when(s.span.from)} to {when(s.span.to)}
          </>
        )}
      </li>
      {s.strongest && (
        <li data-testid="survey-strongest">
          Strongest single reading: {levelLabel(s.strongest.level)} ({dbm(s.strongest.levelDbm)}) at {when(s.strongest.takenAt)}, near {formatLatLon(s.strongest.lat, s.strongest.lon)}
        </li>
      )}
      {s.peak && (
        <li>
          Level peak, smoothed over neighbouring points: {dbm(s.peak.levelDbm)} near {formatLatLon(s.peak.lat, s.peak.lon)}
        </li>
      )}
      {!!s.unmatchedCsvRows?.length && (
        <li>
          Left out, no track point within {s.toleranceS} s: CSV {s.unmatchedCsvRows.length === 1 ? 'row' : 'rows'} {s.unmatchedCsvRows.join(', ')}
        </li>
      )}
    </ul>
  );
}

/**
 * A walked survey from files (GPX track, optionally a CSV of timed levels): check first (the
 * server's dry run: counts, time span, strongest reading, every problem by line and row), then
 * import all points or none. The trail then shows on the case map. For those who may hunt the case.
 */
export function SurveyImportCard({ caseId, defaultFrequencyKhz }: { caseId: string; defaultFrequencyKhz?: number }) {
  const url = `/api/cases/${caseId}/readings/import`;
  const { mutate } = useSWRConfig();
  const mode = useRef<'check' | 'import'>('check');
  const [preview, setPreview] = useState<Preview | null>(null);
  const [done, setDone] = useState<Imported | null>(null);
  const [files, setFiles] = useState<{ gpx?: string; csv?: string }>({});
  const [inputsKey, setInputsKey] = useState(0);
  const { form, submit, problem, setProblem, pending } = useApiForm(surveyImportSchema, {
    defaultValues: { gpx: '', csv: undefined, toleranceS: 5, frequencyKhz: defaultFrequencyKhz },
    request: (v) => ({ url: mode.current === 'check' ? `${url}?dryRun=1` : url, body: v }),
    onSuccess: async (data) => {
      if (mode.current === 'check') return setPreview(data as Preview);
      setDone(data as Imported);
      setPreview(null);
      setFiles({});
      setInputsKey((k) => k + 1);
      form.reset({ gpx: '', csv: undefined, toleranceS: form.getValues('toleranceS'), frequencyKhz: form.getValues('frequencyKhz') });
      await mutate(`/api/cases/${caseId}/readings`);
    },
  });
  // Any change to the files or settings makes the last check stale.
  useEffect(() => {
    const sub = form.watch(() => setPreview(null));
    return () => sub.unsubscribe();
  }, [form]);
  const errors = form.formState.errors;

  const choose = async (which: 'gpx' | 'csv', file: File | undefined) => {
    setDone(null);
    setProblem(null);
    setFiles((f) => ({ ...f, [which]: file?.name }));
    const text = file ? await file.text() : undefined;
    form.setValue(which, which === 'gpx' ? (text ?? '') : text, { shouldValidate: form.formState.isSubmitted });
  };
  const send = (m: 'check' | 'import') => {
    mode.current = m;
    void submit();
  };
  const serverProblems = problem?.body?.problems as SurveyProblem[] | undefined;

  return (
    <section className="card min-w-0 space-y-3" aria-labelledby="survey-import-heading" data-testid="survey-import">
      <h2 id="survey-import-heading" className="text-lg font-bold">
        Import a walked survey
      </h2>
      <p className="text-sm">
        A GPX track of the walk, and a CSV with one row per level and the columns <code>time</code> (ISO 8601 with its time zone, e.g.
        2026-11-30T14:05:10Z), <code>level</code> and optionally <code>unit</code> (S or dBm, S when left out), each level placed where the track was
        at that time; without a CSV, each track point needs its level in a <code>&lt;level unit=&quot;S&quot;&gt;</code> extension.
      </p>
      <p className="rounded-lg bg-flare-100 px-3 py-2 text-sm text-ink" role="note">
        Survey from public ground only and never touch anyone’s equipment; a loud spot is where to listen closer, not an accusation. Read the{' '}
        <Link href="/cautions">cautions</Link>.
      </p>
      <FormProvider {...form}>
        <form
          noValidate
          className="space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            send('check');
          }}
        >
          <FileChoice key={`gpx${inputsKey}`} id="survey-gpx" label="GPX track (.gpx)" accept=".gpx,application/gpx+xml,application/xml,text/xml" error={errors.gpx?.message} onFile={(f) => void choose('gpx', f)} />
          <FileChoice key={`csv${inputsKey}`} id="survey-csv" label="CSV of timed levels (optional)" accept=".csv,text/csv,text/plain" error={errors.csv?.message} onFile={(f) => void choose('csv', f)} />
          <div className="grid gap-3 sm:grid-cols-2">
            <NumberField
              id="survey-tolerance"
              label="Time tolerance (seconds)"
              hint="A level joins the track point nearest in time if it lies within this many seconds (0 to 120)."
              error={errors.toleranceS?.message}
              min={0}
              max={120}
              registration={form.register('toleranceS', { setValueAs: (v) => (v === '' || v === undefined ? undefined : Number(v)) })}
            />
            <FrequencyField id="survey-frequency" />
          </div>
          <FormProblemBox problem={problem} title="Nothing was imported" />
          {serverProblems && serverProblems.length > 1 && <ProblemList problems={serverProblems} count={Number(problem?.body?.problemCount) || serverProblems.length} />}
          <button type="submit" className="btn-quiet min-h-12 w-full sm:w-auto" disabled={pending || !files.gpx}>
            {pending && mode.current === 'check' ? 'Checking…' : 'Check the files'}
          </button>
        </form>
      </FormProvider>
      {preview && !preview.ok && (
        <NoticeBox tone="error" title="These files cannot be imported as they are">
          <ProblemList problems={preview.problems} count={preview.problemCount} />
          <p className="mt-1">Nothing was stored. Correct the file and choose it again.</p>
        </NoticeBox>
      )}
      {preview?.ok && (
        <div className="space-y-2 rounded-lg border border-hush-500 bg-hush-50 p-3 text-sm text-hush-900" data-testid="survey-preview" role="status">
          <p className="font-bold">Ready to import ({files.gpx}{files.csv ? ` + ${files.csv}` : ''})</p>
          <SurveyFacts s={preview} />
          <button type="button" className="btn-primary min-h-12 w-full sm:w-auto" disabled={pending} onClick={() => send('import')}>
            {pending && mode.current === 'import' ? 'Importing…' : `Import ${preview.points} ${preview.points === 1 ? 'point' : 'points'}`}
          </button>
        </div>
      )}
      {done && (
        <NoticeBox title="Survey imported">
          <p data-testid="survey-imported">
            {done.imported} {done.imported === 1 ? 'point was' : 'points were'} added to the case’s level trail; the case map shows them as the imported survey, with
            its strongest reading marked.
          </p>
        </NoticeBox>
      )}
    </section>
  );
}
