import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/session';
import { listCasesFor } from '@/db/cases';
import { listActiveHunters } from '@/db/users';
import { CASE_STATUSES } from '@/db/types';
import { BANDS } from '@/lib/hunt/bands';
import { caseFilterSchema } from '@/lib/validation/cases';
import { pagingSchema } from '@/lib/api/paging';
import { StatusBadge } from '@/components/status-badge';

export const metadata: Metadata = { title: 'Cases' };


const HEADINGS = { admin: 'All cases', coordinator: 'All cases', hunter: 'Cases assigned to you', member: 'Your reports' } as const;

export default async function CasesPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePageUser();
  const sp = await searchParams;
  // The API's own filter schema; a hand-edited address that does not parse just shows everything.
  const parsed = caseFilterSchema.safeParse(Object.fromEntries(Object.entries(sp).filter(([k, v]) => v && k in caseFilterSchema.shape)));
  const filter = parsed.success ? parsed.data : {};
  const paging = pagingSchema.catch({ page: 1, pageSize: 25 }).parse(sp);
  const committee = user.role === 'admin' || user.role === 'coordinator';
  const [{ items, total }, hunters] = await Promise.all([listCasesFor(user, filter, paging), committee ? listActiveHunters() : []]);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">{HEADINGS[user.role]}</h1>
      <form className="flex flex-wrap items-end gap-2" role="search">
        <div>
          <label htmlFor="q" className="label">
            Search
          </label>
          <input id="q" name="q" defaultValue={filter.q} className="field w-56" placeholder="title or reference" />
        </div>
        <FilterSelect name="status" label="Status" value={filter.status} anyLabel="any" width="w-40" options={CASE_STATUSES.map((x) => ({ value: x, label: x }))} />
        <FilterSelect name="band" label="Band" value={filter.band} anyLabel="any" width="w-32" options={BANDS.map((b) => ({ value: b.name, label: b.name }))} />
        {committee && (
          <FilterSelect name="assigneeId" label="Hunter" value={filter.assigneeId} anyLabel="anyone" width="w-48" options={hunters.map((h) => ({ value: h.id, label: h.name }))} />
        )}
        <button className="btn-quiet">Filter</button>
        <Link href="/reports/new" className="btn-primary ml-auto">
          Report noise
        </Link>
      </form>
      <p className="text-sm text-ink-soft">{total === 1 ? '1 case' : `${total} cases`}</p>
      {items.length === 0 ? (
        <p className="card text-ink-soft">No cases here yet.</p>
      ) : (
        <ul className="space-y-2" aria-label="Cases">
          {items.map((c) => (
            <li key={c.id} className="card flex flex-wrap items-center gap-x-3 gap-y-1">
              <span className="font-mono text-sm text-ink-faint">{c.reference}</span>
              <StatusBadge status={c.status} />
              <Link href={`/cases/${c.id}`} className="min-w-0 flex-1 basis-full font-semibold text-ink sm:basis-auto">
                {c.title}
              </Link>
              <span className="text-sm text-ink-soft">{c.bands.join(', ')}</span>
              <span className="text-sm text-ink-soft">{c.assigneeName ? `hunter: ${c.assigneeName}` : 'unassigned'}</span>
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-ink-faint">
        Before you go out, read the <Link href="/cautions">cautions</Link>.
      </p>
    </div>
  );
}

/** One labelled filter of the search form (a plain GET form: works without JavaScript). */
function FilterSelect(p: { name: string; label: string; value?: string; anyLabel: string; width: string; options: { value: string; label: string }[] }) {
  return (
    <div>
      <label htmlFor={p.name} className="label">
        {p.label}
      </label>
      <select id={p.name} name={p.name} defaultValue={p.value ?? ''} className={`field ${p.width}`}>
        <option value="">{p.anyLabel}</option>
        {p.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}
