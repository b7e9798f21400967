// The projects list: search, sort by any column, filter by role (@tanstack/react-table).
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnDef, type ColumnFiltersState, type SortingState,
} from '@tanstack/react-table';
import { cloudPaths } from './routeIds';
import type { ProjectSummary, Role } from './types';
import { inputClass, RoleBadge, When } from './ui';

const columns: ColumnDef<ProjectSummary>[] = [
  { accessorKey: 'title', header: 'Title', cell: ({ row }) => <Link className="font-medium text-accent hover:underline" to={cloudPaths.project(row.original.id)}>{row.original.title}</Link> },
  { accessorKey: 'role', header: 'Your role', cell: ({ row }) => <RoleBadge role={row.original.role} />, filterFn: 'equals' },
  {
    id: 'updatedAt', header: 'Last change', accessorFn: (p) => Date.parse(p.updatedAt),
    cell: ({ row }) => <span><When iso={row.original.updatedAt} />{row.original.updatedBy ? <span className="text-ink-muted"> by {row.original.updatedBy.name ?? row.original.updatedBy.login}</span> : null}</span>,
  },
  { accessorKey: 'partCount', header: 'Parts', cell: ({ getValue }) => <span className="num">{getValue<number>()}</span> },
  { accessorKey: 'memberCount', header: 'People', cell: ({ getValue }) => <span className="num">{getValue<number>()}</span> },
  { id: 'settings', header: () => <span className="sr-only">Actions</span>, enableSorting: false, cell: ({ row }) => <Link className="text-sm text-ink-muted hover:text-ink" to={cloudPaths.settings(row.original.id)} aria-label={`Settings of ${row.original.title}`}>Settings</Link> },
];

export function ProjectsTable({ projects }: { projects: ProjectSummary[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'updatedAt', desc: true }]);
  const [search, setSearch] = useState('');
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const table = useReactTable({
    data: projects,
    columns,
    state: { sorting, globalFilter: search, columnFilters: filters },
    onSortingChange: setSorting,
    onGlobalFilterChange: setSearch,
    onColumnFiltersChange: setFilters,
    globalFilterFn: (row, _col, value: string) => row.original.title.toLowerCase().includes(value.toLowerCase()),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const role = (filters.find((f) => f.id === 'role')?.value as Role | undefined) ?? '';
  const rows = table.getRowModel().rows;
  const sortMark = useMemo(() => ({ asc: ' ▲', desc: ' ▼' }) as const, []);

  return (
    <div className="mt-4">
      <div className="flex flex-wrap gap-3">
        <input className={inputClass} type="search" placeholder="Search titles" aria-label="Search projects" value={search} onChange={(e) => setSearch(e.target.value)} />
        <select className={inputClass} aria-label="Filter by role" value={role} onChange={(e) => setFilters(e.target.value ? [{ id: 'role', value: e.target.value }] : [])}>
          <option value="">Any role</option>
          <option value="owner">Owner</option>
          <option value="editor">Editor</option>
          <option value="viewer">Viewer</option>
        </select>
      </div>
      <table className="mt-3 w-full border-collapse text-left text-sm">
        <thead>
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id} className="border-b border-rule">
              {hg.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <th key={h.id} className="py-2 pr-3 font-medium" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}>
                    {h.column.getCanSort() ? (
                      <button type="button" onClick={h.column.getToggleSortingHandler()} className="hover:text-accent">
                        {flexRender(h.column.columnDef.header, h.getContext())}{sorted ? sortMark[sorted] : ''}
                      </button>
                    ) : flexRender(h.column.columnDef.header, h.getContext())}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-rule/60" data-project-id={r.original.id}>
              {r.getVisibleCells().map((c) => <td key={c.id} className="py-2 pr-3">{flexRender(c.column.columnDef.cell, c.getContext())}</td>)}
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length === 0 ? <p className="mt-4 text-ink-muted">{projects.length === 0 ? 'No projects yet: create one above, or ask a colleague to invite you.' : 'No project matches.'}</p> : null}
    </div>
  );
}
