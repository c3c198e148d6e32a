import { useMemo, useState } from 'react';
import {
  createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getPaginationRowModel, getSortedRowModel, useReactTable,
  type ColumnDef, type ColumnFiltersState, type Header, type SortingState,
} from '@tanstack/react-table';
import type { ClassResults, LearnerRow } from '../../lib/results/class-results';
import { STAGE_LABELS } from '../trainer/labels';
import { STATUS_RANK, STATUS_TEXT, attemptHref, formatDate, formatDateTime, formatPct } from './format';

// One row a learner: per drill each stage's best score and attempt count (linked to the latest attempt),
// the drill's standing, the last activity and the latest bench sign-off per procedure. Sort by any
// column, search by name, filter by a drill's standing, page through.

const col = createColumnHelper<LearnerRow>();
const PAGE_SIZES = [10, 25, 50];

type Results = Pick<ClassResults, 'drills' | 'signOffProcedures' | 'learners'>;

function columnsFor(results: Results): ColumnDef<LearnerRow, any>[] {
  const drillColumns = results.drills.map((drill, d) =>
    col.group({
      id: `drill-${drill.id}`,
      header: () => (
        <span className="block">
          <span className="block font-bold text-steel-900">{drill.title}</span>
          <span className="block text-xs font-normal text-steel-600">
            due {formatDate(drill.dueAt)} · pass mark {drill.passMarkPct} %
          </span>
        </span>
      ),
      columns: [
        ...drill.stages.map((stage, s) =>
          col.accessor((row) => row.drills[d]!.stages[s]!.bestPct ?? undefined, {
            id: `drill-${drill.id}-${stage}`,
            header: STAGE_LABELS[stage],
            sortUndefined: 'last',
            cell: ({ row }) => {
              const cell = row.original.drills[d]!.stages[s]!;
              if (cell.attempts === 0) return <span className="text-steel-500">— <span className="sr-only">not tried</span></span>;
              return (
                <a
                  href={attemptHref(cell.latestAttemptId!)}
                  className="block rounded underline decoration-brass-400 underline-offset-4 hover:bg-brass-50"
                  aria-label={`${row.original.name}, ${STAGE_LABELS[stage]}: best ${formatPct(cell.bestPct)}, ${cell.attempts} ${cell.attempts === 1 ? 'try' : 'tries'}${cell.passed ? ', reached the pass mark' : ''}; review the latest attempt`}
                >
                  <span className="font-semibold">
                    {cell.passed && <span aria-hidden="true" className="text-go-700">✓ </span>}
                    {formatPct(cell.bestPct)}
                  </span>
                  <span className="block text-xs text-steel-600">
                    {cell.attempts} {cell.attempts === 1 ? 'try' : 'tries'}
                  </span>
                </a>
              );
            },
          }),
        ),
        col.accessor((row) => STATUS_RANK[row.drills[d]!.status] * 1000 + (row.drills[d]!.bestPct ?? -1), {
          id: `drill-${drill.id}-result`,
          header: 'Result',
          filterFn: (row, _id, wanted: 'passed' | 'not-passed') => (wanted === 'passed') === row.original.drills[d]!.passed,
          cell: ({ row }) => {
            const standing = row.original.drills[d]!;
            const status = STATUS_TEXT[standing.status];
            return (
              <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-sm font-semibold ${status.tone}`}>
                <span aria-hidden="true">{status.icon}</span>
                {status.text}
                {standing.bestPct !== null && <span className="font-normal"> · {formatPct(standing.bestPct)}</span>}
              </span>
            );
          },
        }),
      ],
    }),
  );

  const signOffColumns = results.signOffProcedures.length
    ? [
        col.group({
          id: 'sign-offs',
          header: 'Bench sign-off (latest)',
          columns: results.signOffProcedures.map((procedure) =>
            col.accessor((row) => row.signOffs.find((s) => s.procedureId === procedure.id)?.benchDate, {
              id: `sign-off-${procedure.id}`,
              header: procedure.title,
              sortUndefined: 'last',
              cell: ({ row }) => {
                const s = row.original.signOffs.find((x) => x.procedureId === procedure.id);
                if (!s) return <span className="text-steel-500">— <span className="sr-only">no sign-off</span></span>;
                return (
                  <span title={s.notes || undefined}>
                    <span className={`font-semibold ${s.outcome === 'pass' ? 'text-go-700' : 'text-brass-800'}`}>
                      <span aria-hidden="true">{s.outcome === 'pass' ? '✓ ' : '↻ '}</span>
                      {s.outcome === 'pass' ? 'Pass' : 'Redo'}
                    </span>
                    <span className="block text-xs text-steel-600">{formatDate(s.benchDate)}</span>
                  </span>
                );
              },
            }),
          ),
        }),
      ]
    : [];

  return [
    col.accessor('name', {
      id: 'learner',
      header: 'Learner',
      filterFn: 'includesString',
      cell: ({ row }) => (
        <span>
          <span className="block font-semibold text-steel-900">{row.original.name}</span>
          <span className="block text-xs text-steel-600">{row.original.email}</span>
        </span>
      ),
    }),
    ...drillColumns,
    col.accessor((row) => row.lastActivity ?? undefined, {
      id: 'last-activity',
      header: 'Last activity',
      sortUndefined: 'last',
      cell: ({ row }) => <span className="whitespace-nowrap text-sm">{formatDateTime(row.original.lastActivity)}</span>,
    }),
    ...signOffColumns,
  ];
}

function SortHeader({ header }: { header: Header<LearnerRow, unknown> }) {
  const label = flexRender(header.column.columnDef.header, header.getContext());
  if (!header.column.getCanSort() || header.isPlaceholder || header.subHeaders.length) return <>{label}</>;
  const sorted = header.column.getIsSorted();
  return (
    <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex min-h-touch items-center gap-1 text-left font-semibold hover:underline">
      {label}
      <span aria-hidden="true" className="text-steel-500">
        {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
      </span>
    </button>
  );
}

export default function ResultsTable({ results }: { results: Results }) {
  const columns = useMemo(() => columnsFor(results), [results]);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'learner', desc: false }]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const [pagination, setPagination] = useState({ pageIndex: 0, pageSize: PAGE_SIZES[1]! });

  const table = useReactTable({
    data: results.learners,
    columns,
    state: { sorting, columnFilters: filters, pagination },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    onPaginationChange: setPagination,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
  });

  const search = (table.getColumn('learner')?.getFilterValue() as string | undefined) ?? '';
  const standing = filters.find((f) => f.id.endsWith('-result'));
  const standingValue = standing ? `${standing.id}|${standing.value as string}` : '';
  const setStanding = (value: string) => {
    const [id, wanted] = value.split('|');
    setFilters((old) => [...old.filter((f) => !f.id.endsWith('-result')), ...(id && wanted ? [{ id, value: wanted }] : [])]);
  };

  const shown = table.getFilteredRowModel().rows.length;
  const { pageIndex, pageSize } = table.getState().pagination;

  return (
    <div>
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <label className="block min-w-[14rem] flex-1">
          <span className="field-label">Search by name</span>
          <input
            type="search"
            className="field-input"
            value={search}
            onChange={(e) => table.getColumn('learner')?.setFilterValue(e.target.value || undefined)}
            placeholder="Type a learner's name"
          />
        </label>
        {results.drills.length > 0 && (
          <label className="block min-w-[14rem] flex-1">
            <span className="field-label">Show</span>
            <select className="field-input" value={standingValue} onChange={(e) => setStanding(e.target.value)}>
              <option value="">Every learner</option>
              {results.drills.map((drill) => (
                <optgroup key={drill.id} label={drill.title}>
                  <option value={`drill-${drill.id}-result|not-passed`}>Not yet passed: {drill.title}</option>
                  <option value={`drill-${drill.id}-result|passed`}>Passed: {drill.title}</option>
                </optgroup>
              ))}
            </select>
          </label>
        )}
      </div>

      <p className="mb-2 text-sm text-steel-700" role="status" data-testid="results-count">
        {shown} of {results.learners.length} learners
      </p>

      <div className="overflow-x-auto rounded-lg border border-steel-200">
        <table className="w-full min-w-max border-collapse text-left" data-testid="results-table">
          <thead className="bg-steel-50 text-sm text-steel-700">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const leaf = header.subHeaders.length === 0 && !header.isPlaceholder;
                  return (
                    <th
                      key={header.id}
                      colSpan={header.colSpan}
                      scope={header.colSpan > 1 ? 'colgroup' : 'col'}
                      aria-sort={leaf && sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : undefined}
                      className={`border-b border-steel-200 px-3 py-1 align-bottom ${header.colSpan > 1 ? 'border-l text-center' : ''}`}
                    >
                      {header.isPlaceholder ? null : <SortHeader header={header} />}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-steel-100 bg-white">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell, i) =>
                  i === 0 ? (
                    <th key={cell.id} scope="row" className="px-3 py-2 text-left font-normal">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </th>
                  ) : (
                    <td key={cell.id} className="px-3 py-2 align-top">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ),
                )}
              </tr>
            ))}
            {shown === 0 && (
              <tr>
                <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-6 text-center text-steel-600">
                  {results.learners.length === 0 ? 'No learners have joined this class yet.' : 'No learner matches.'}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      <nav className="mt-3 flex flex-wrap items-center gap-3" aria-label="Results pages">
        <button type="button" className="btn-quiet" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          <span aria-hidden="true">←</span> Previous
        </button>
        <span className="text-sm text-steel-700">
          Page {shown === 0 ? 0 : pageIndex + 1} of {table.getPageCount()}
        </span>
        <button type="button" className="btn-quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          Next <span aria-hidden="true">→</span>
        </button>
        <label className="ml-auto flex items-center gap-2 text-sm">
          Learners per page
          <select className="field-input w-auto" value={pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))}>
            {PAGE_SIZES.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
      </nav>
    </div>
  );
}
