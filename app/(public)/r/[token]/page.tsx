import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/errors';
import { recipientView, type RecipientView } from '@/lib/notices/recipient';
import { AnswerForm } from './answer-form';
import { NoiseExplainer } from './noise-explainer';

export const metadata: Metadata = { title: 'A note from your local radio club', robots: { index: false, follow: false }, referrer: 'no-referrer' };
export const dynamic = 'force-dynamic';

/** The neighbour's page: the notice, a short illustrated explainer, and a way to answer. No account, no reporter data. */
export default async function RecipientPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let view: RecipientView;
  try {
    view = await recipientView(token);
  } catch (err) {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  }
  return (
    <div className="mx-auto max-w-2xl space-y-6">
      <header className="space-y-1">
        <p className="text-sm font-semibold text-ink-soft">{view.clubName} · {view.noticeDate}</p>
        <h1 className="text-2xl font-extrabold break-words">{view.subject}</h1>
      </header>
      {/* Our own renderer escapes every value; the markup is only <p>, <br>, <ul>, <li> and the link. */}
      <article className="card notice-text space-y-3 break-words [&_li]:ml-5 [&_li]:list-disc" dangerouslySetInnerHTML={{ __html: view.html }} />
      <NoiseExplainer />
      <section aria-labelledby="answer-heading" className="card space-y-3">
        <h2 id="answer-heading" className="text-xl font-bold">Your answer</h2>
        <p className="text-sm text-ink-soft">
          It goes to the club’s interference committee only. This page works until {view.expiresOn}; you can also write to{' '}
          <a href={`mailto:${view.clubContactEmail}`}>{view.clubContactEmail}</a>.
        </p>
        {view.answers.length > 0 && (
          <div>
            <h3 className="font-semibold">Answers so far</h3>
            <ul className="list-disc pl-5 text-sm">
              {view.answers.map((a, i) => (
                <li key={i}>
                  {a.label} — {a.on}
                </li>
              ))}
            </ul>
          </div>
        )}
        <AnswerForm token={token} />
      </section>
    </div>
  );
}
