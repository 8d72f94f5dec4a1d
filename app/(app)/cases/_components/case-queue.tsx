'use client';

import { useCallback, useMemo, useState } from 'react';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import useSWR from 'swr';
import type { RowSelectionState } from '@tanstack/react-table';
import { callApi, fetchJson } from '@/lib/api/client';
import type { QueuePage } from '@/db/queue';
import type { MapCell } from '@/db/case-map';
import { CASE_STATUSES } from '@/db/types';
import { BANDS } from '@/lib/hunt/bands';
import { AREA_MAX_VERTICES, AREA_MIN_VERTICES, areaSchema, areaText, type QueueSort } from '@/lib/validation/queue';
import { CasesOverviewMapClient } from '@/components/map/cases-overview-map-client';
import { CasesMapLegend } from '@/components/map/cases-map-legend';
import type { MapView } from '@/components/map/cases-overview-map';
import { QueueTable, type QueueRow } from './queue-table';
import { SavedViews } from './saved-views';
import { FILTER_KEYS, bboxText, pick, withChanges } from './queue-params';

type Person = { id: string; name: string };
type Answer = Omit<QueuePage, 'items'> & { items: QueueRow[] };

/**
 * The committee's queue: the table and the map of all cases share the filters, and the URL holds
 * the whole view (filters, sort, page), so a link or a saved view opens the same thing.
 */
export function CaseQueue(p: { committee: boolean; hunters: Person[]; saved: { id: string; name: string; query: string }[]; mapStart: { lat: number; lon: number } | null }) {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const go = useCallback((next: URLSearchParams) => router.replace(`${pathname}${next.size ? `?${next}` : ''}`, { scroll: false }), [router, pathname]);
  const set = (changes: Record<string, string | null>) => go(withChanges(sp, changes));

  const query = pick(sp, [...FILTER_KEYS, 'sort', 'dir', 'cursor', 'page', 'pageSize']).toString();
  const { data, error, isLoading, mutate } = useSWR<Answer>(`/api/cases${query ? `?${query}` : ''}`, fetchJson, { keepPreviousData: true });
  const [cursors, setCursors] = useState<string[]>([]);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [assignTo, setAssignTo] = useState('');
  const [message, setMessage] = useState<string | null>(null);

  const filters = pick(sp, FILTER_KEYS).toString();
  const [view, setView] = useState<MapView | null>(null);
  const [heat, setHeat] = useState(false);
  /** the area's vertices ([lon, lat]) while one is being drawn */
  const [draft, setDraft] = useState<[number, number][] | null>(null);
  const [drawProblem, setDrawProblem] = useState<string | null>(null);
  const mapUrl = view ? `/api/cases/map?bbox=${bboxText(view.bbox)}&zoom=${view.zoom}${heat ? '&heat=1' : ''}${filters ? `&${filters}` : ''}` : null;
  const { data: map } = useSWR<{ cells: MapCell[]; cellDeg: number; truncated: boolean }>(mapUrl, fetchJson, { keepPreviousData: true });
  const parsedArea = areaSchema.safeParse(sp.get('area') ?? undefined);
  const area = parsedArea.success ? parsedArea.data : undefined;
  const start = useMemo(() => (area ? { ...areaMiddle(area.vertices), zoom: 13 } : p.mapStart ? { ...p.mapStart, zoom: 12 } : { lat: 20, lon: 0, zoom: 2 }), []); // eslint-disable-line react-hooks/exhaustive-deps

  function addPoint(v: [number, number]) {
    setDrawProblem(null);
    setDraft((d) => (d && d.length < AREA_MAX_VERTICES ? [...d, v] : d));
  }
  function closeArea() {
    const checked = areaSchema.safeParse(areaText({ vertices: draft ?? [] }));
    if (!checked.success) return setDrawProblem(checked.error.issues[0].message);
    setDraft(null);
    setCursors([]);
    set({ area: areaText(checked.data) });
  }

  const sort = (data?.sort ?? sp.get('sort') ?? 'lastActivity') as QueueSort;
  const dir = (data?.dir ?? sp.get('dir') ?? 'desc') as 'asc' | 'desc';
  const selected = Object.keys(selection).filter((k) => selection[k]);
  const totalText = data ? (data.totalCapped ? `${data.total.toLocaleString('en')}+` : data.total.toLocaleString('en')) : '…';

  async function bulkAssign() {
    const r = await callApi<{ changed: number }>('/api/cases/bulk-assign', { body: { caseIds: selected, assigneeId: assignTo === 'none' ? null : assignTo } });
    setMessage(r.ok ? `${r.data.changed} ${r.data.changed === 1 ? 'case' : 'cases'} reassigned.` : r.error);
    if (r.ok) {
      setSelection({});
      mutate();
    }
  }

  return (
    <div className="space-y-4">
      <SavedViews saved={p.saved} current={withChanges(sp, {}).toString()} />
      <form
        className="flex flex-wrap items-end gap-2"
        role="search"
        onSubmit={(e) => {
          e.preventDefault();
          const fd = new FormData(e.currentTarget);
          set({ q: String(fd.get('q') ?? ''), minDays: String(fd.get('minDays') ?? '') });
          setCursors([]);
        }}
      >
        <div>
          <label htmlFor="q" className="label">Search</label>
          <input id="q" name="q" key={sp.get('q') ?? ''} defaultValue={sp.get('q') ?? ''} className="field w-56" placeholder="reference, title, description" />
        </div>
        <Select id="status" label="Status" value={sp.get('status') ?? ''} onChange={(v) => set({ status: v })} options={[{ value: '', label: 'any' }, { value: 'open,located,notified', label: 'not resolved' }, ...CASE_STATUSES.map((s) => ({ value: s, label: s }))]} />
        <Select id="band" label="Band" value={sp.get('band') ?? ''} onChange={(v) => set({ band: v })} options={[{ value: '', label: 'any' }, ...BANDS.map((b) => ({ value: b.name, label: b.name }))]} />
        {p.committee && (
          <Select id="assigneeId" label="Hunter" value={sp.get('assigneeId') ?? ''} onChange={(v) => set({ assigneeId: v })} options={[{ value: '', label: 'anyone' }, { value: 'none', label: 'unassigned' }, ...p.hunters.map((h) => ({ value: h.id, label: h.name }))]} />
        )}
        <div>
          <label htmlFor="minDays" className="label">Days in state ≥</label>
          <input id="minDays" name="minDays" type="number" min={0} key={sp.get('minDays') ?? ''} defaultValue={sp.get('minDays') ?? ''} className="field w-24" />
        </div>
        <button className="btn-quiet">Filter</button>
        {area && (
          <button type="button" className="btn-quiet" onClick={() => set({ area: null })}>
            Clear the drawn area
          </button>
        )}
      </form>

      <section aria-label="Map of cases" className="space-y-2">
        <div className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label="Area on the map">
          {draft === null ? (
            <button type="button" className="btn-quiet min-h-11" onClick={() => { setDrawProblem(null); setDraft([]); }}>
              {area ? 'Draw a new area' : 'Draw an area'}
            </button>
          ) : (
            <>
              <span role="status" data-testid="draw-status">
                {draft.length < AREA_MIN_VERTICES ? `Tap the map for each corner (${draft.length} of at least ${AREA_MIN_VERTICES})` : `${draft.length} corners: close the area when done`}
              </span>
              <button type="button" className="btn-quiet min-h-11" disabled={!view || draft.length >= AREA_MAX_VERTICES} onClick={() => view && addPoint([(view.bbox.west + view.bbox.east) / 2, (view.bbox.south + view.bbox.north) / 2])}>
                Add the map's centre
              </button>
              <button type="button" className="btn-quiet min-h-11" disabled={draft.length === 0} onClick={() => { setDrawProblem(null); setDraft(draft.slice(0, -1)); }}>
                Undo last corner
              </button>
              <button type="button" className="btn-primary min-h-11" disabled={draft.length < AREA_MIN_VERTICES} onClick={closeArea}>
                Close the area
              </button>
              <button type="button" className="btn-quiet min-h-11" onClick={() => { setDrawProblem(null); setDraft(null); }}>
                Stop drawing
              </button>
            </>
          )}
          {drawProblem && <span role="alert" className="font-semibold text-alarm-600">{drawProblem}</span>}
          <label className="flex items-center gap-1.5">
            <input type="checkbox" checked={heat} onChange={(e) => setHeat(e.target.checked)} /> heat view of open cases
          </label>
          {map && <span className="text-ink-faint" data-testid="map-count">{map.cells.reduce((s, c) => s + c.count, 0).toLocaleString('en')} on the map{map.truncated ? ' (zoom in to see all)' : ''}</span>}
        </div>
        <CasesOverviewMapClient
          cells={map?.cells ?? []}
          cellDeg={map?.cellDeg ?? 0}
          heat={heat}
          area={area}
          draft={draft}
          start={start}
          onView={setView}
          onDraftPoint={addPoint}
          onOpenCase={(id) => router.push(`/cases/${id}`)}
        />
        <CasesMapLegend heat={heat} />
      </section>

      {p.committee && selected.length > 0 && (
        <div className="card flex flex-wrap items-center gap-2" aria-label="Bulk assignment">
          <span className="font-semibold">{selected.length} selected</span>
          <label htmlFor="assignTo" className="sr-only">Assign to</label>
          <select id="assignTo" className="field w-48" value={assignTo} onChange={(e) => setAssignTo(e.target.value)}>
            <option value="">choose a hunter…</option>
            <option value="none">nobody (unassign)</option>
            {p.hunters.map((h) => (
              <option key={h.id} value={h.id}>{h.name}</option>
            ))}
          </select>
          <button type="button" className="btn-primary" disabled={!assignTo} onClick={bulkAssign}>
            Assign selected
          </button>
        </div>
      )}
      {message && <p role="status" className="text-sm">{message}</p>}

      <p className="text-sm text-ink-soft" data-testid="queue-total">
        {error ? <span role="alert">{(error as Error).message}</span> : `${totalText} ${data?.total === 1 ? 'case' : 'cases'}${isLoading ? ' (loading…)' : ''}`}
      </p>
      {data && data.items.length === 0 ? (
        <p className="card text-ink-soft">No cases match this view.</p>
      ) : (
        <QueueTable
          rows={data?.items ?? []}
          sort={sort}
          dir={dir}
          onSort={(s, d) => {
            setCursors([]);
            set({ sort: s, dir: d });
          }}
          selectable={p.committee}
          selection={selection}
          onSelection={setSelection}
        />
      )}
      <nav className="flex items-center gap-2" aria-label="Pages">
        <button type="button" className="btn-quiet" disabled={!sp.get('cursor') && !sp.get('page')} onClick={() => { setCursors([]); set({}); }}>
          First page
        </button>
        <button
          type="button"
          className="btn-quiet"
          disabled={cursors.length === 0}
          onClick={() => {
            const prev = cursors.slice(0, -1);
            setCursors(prev);
            set({ cursor: prev.at(-1) ?? null });
          }}
        >
          Previous
        </button>
        <button
          type="button"
          className="btn-quiet"
          disabled={!data?.nextCursor}
          onClick={() => {
            setCursors([...cursors, data!.nextCursor!]);
            set({ cursor: data!.nextCursor });
          }}
        >
          Next
        </button>
      </nav>
    </div>
  );
}

/** The middle of the area's vertices (for where the map opens). */
function areaMiddle(vertices: [number, number][]) {
  const lons = vertices.map((v) => v[0]);
  const lats = vertices.map((v) => v[1]);
  return { lon: (Math.min(...lons) + Math.max(...lons)) / 2, lat: (Math.min(...lats) + Math.max(...lats)) / 2 };
}

function Select(p: { id: string; label: string; value: string; onChange: (v: string) => void; options: { value: string; label: string }[] }) {
  return (
    <div>
      <label htmlFor={p.id} className="label">{p.label}</label>
      <select id={p.id} className="field w-40" value={p.value} onChange={(e) => p.onChange(e.target.value)}>
        {p.options.map((o) => (
          <option key={o.value} value={o.value}>{o.label}</option>
        ))}
      </select>
    </div>
  );
}
