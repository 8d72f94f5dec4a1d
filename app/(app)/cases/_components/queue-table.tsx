'use client';

import Link from 'next/link';
import { createColumnHelper, rowSelectionFeature, rowSortingFeature, tableFeatures, useTable, type RowSelectionState, type SortingState } from '@tanstack/react-table';
import { StatusBadge } from '@/components/status-badge';
import type { QueueItem } from '@/db/queue';
import type { QueueSort } from '@/lib/validation/queue';

type Row = Omit<QueueItem, 'createdAt' | 'updatedAt' | 'statusSince' | 'lastActivityAt'> & { statusSince: string; lastActivityAt: string };

const features = tableFeatures({ rowSortingFeature, rowSelectionFeature });
const helper = createColumnHelper<typeof features, Row>();

const DAY = 86_400_000;
const daysSince = (iso: string) => Math.max(0, Math.floor((Date.now() - new Date(iso).getTime()) / DAY));
const dateText = (iso: string) => new Date(iso).toLocaleDateString(undefined, { year: 'numeric', month: 'short', day: 'numeric' });

const columns = helper.columns([
  helper.display({
    id: 'select',
    header: ({ table }) => (
      <input type="checkbox" aria-label="Select all on this page" checked={table.getIsAllRowsSelected()} onChange={table.getToggleAllRowsSelectedHandler()} />
    ),
    cell: ({ row }) => <input type="checkbox" aria-label={`Select ${row.original.reference}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />,
  }),
  helper.accessor('reference', {
    id: 'reference',
    header: 'Reference',
    cell: (c) => (
      <Link href={`/cases/${c.row.original.id}`} className="font-mono text-sm font-semibold">
        {c.getValue()}
      </Link>
    ),
  }),
  helper.accessor('title', { id: 'title', header: 'Title', enableSorting: false, cell: (c) => (
      <Link href={`/cases/${c.row.original.id}`} className="line-clamp-2 max-w-72 text-ink">
        {c.getValue()}
      </Link>
    ),
  }),
  helper.accessor('status', { id: 'status', header: 'Status', cell: (c) => <StatusBadge status={c.getValue()} /> }),
  helper.accessor('statusSince', { id: 'stateAge', header: 'Days in state', cell: (c) => daysSince(c.getValue()) }),
  helper.accessor((r) => r.bands.join(', '), { id: 'band', header: 'Band' }),
  helper.accessor((r) => r.assigneeName ?? '—', { id: 'hunter', header: 'Hunter' }),
  helper.accessor('lastActivityAt', { id: 'lastActivity', header: 'Last activity', cell: (c) => dateText(c.getValue()) }),
  helper.accessor('fixSizeM', { id: 'fixSize', header: 'Fix size', cell: (c) => (c.getValue() === null ? '—' : `${Math.round(c.getValue() as number)} m`) }),
  helper.accessor('noticeCount', { id: 'notices', header: 'Notices' }),
]);

/** The queue's table: sorting happens on the server (manualSorting), selection feeds bulk assignment. */
export function QueueTable(p: {
  rows: Row[];
  sort: QueueSort;
  dir: 'asc' | 'desc';
  onSort: (sort: QueueSort, dir: 'asc' | 'desc') => void;
  selectable: boolean;
  selection: RowSelectionState;
  onSelection: (s: RowSelectionState) => void;
}) {
  const sorting: SortingState = [{ id: p.sort, desc: p.dir === 'desc' }];
  const table = useTable({
    features,
    columns,
    data: p.rows,
    getRowId: (r) => r.id,
    manualSorting: true,
    enableSortingRemoval: false,
    state: { sorting, rowSelection: p.selection, columnVisibility: { select: p.selectable } } as never,
    onSortingChange: (up) => {
      const next = typeof up === 'function' ? up(sorting) : up;
      if (next[0]) p.onSort(next[0].id as QueueSort, next[0].desc ? 'desc' : 'asc');
    },
    onRowSelectionChange: (up) => p.onSelection(typeof up === 'function' ? up(p.selection) : up),
  });
  return (
    <div className="overflow-x-auto rounded-lg border border-ink/15 bg-white">
      <table className="w-full text-left text-sm" aria-label="Cases" data-testid="queue-table">
        <thead className="bg-paper-deep">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers
                .filter((h) => p.selectable || h.column.id !== 'select')
                .map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th key={h.id} className="px-2 py-2 font-semibold whitespace-nowrap" aria-sort={sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : undefined}>
                      {h.column.getCanSort() ? (
                        <button type="button" className="font-semibold" onClick={h.column.getToggleSortingHandler()}>
                          <table.FlexRender header={h} /> {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
                        </button>
                      ) : (
                        <table.FlexRender header={h} />
                      )}
                    </th>
                  );
                })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((r) => (
            <tr key={r.id} className="border-t border-ink/10" data-testid="queue-row">
              {r
                .getAllCells()
                .filter((c) => p.selectable || c.column.id !== 'select')
                .map((c) => (
                  <td key={c.id} className="px-2 py-1.5 align-top">
                    <table.FlexRender cell={c} />
                  </td>
                ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
export type { Row as QueueRow };
