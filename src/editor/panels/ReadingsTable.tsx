// The "Readings" tab: every net voltage and part current/power in a sortable table that copies
// to the clipboard (tab-separated, for spreadsheets) and exports as CSV.
import { useMemo, useState } from 'react';
import { flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { useEditor, useEditorState, useSolveState } from '../EditorContext';
import { formatAmps, formatVolts, formatWatts } from '../format/values';
import { netRows, partRows, readingsCsv, type NetRow, type PartRow } from './readingsRows';
import { notify } from '../notices';

const netColumns: ColumnDef<NetRow>[] = [
  { accessorKey: 'net', header: 'Net' },
  { accessorKey: 'voltage', header: 'Voltage', cell: (c) => formatVolts(c.getValue<number>()), meta: { right: true } },
  { accessorKey: 'pins', header: 'Pins', enableSorting: false, cell: (c) => <span className="text-ink-muted">{c.getValue<string>()}</span> },
];

const partColumns: ColumnDef<PartRow>[] = [
  { accessorKey: 'part', header: 'Part' },
  { accessorKey: 'current', header: 'Current', cell: (c) => formatAmps(c.getValue<number>()), meta: { right: true } },
  { accessorKey: 'power', header: 'Power', cell: (c) => formatWatts(c.getValue<number>()), meta: { right: true } },
  {
    accessorKey: 'ratingUse',
    header: 'Of rating',
    sortUndefined: 'last',
    cell: (c) => {
      const v = c.getValue<number | null>();
      if (v === null) return <span className="text-ink-muted">—</span>;
      return <span className={v > 1 ? 'text-danger' : v > 0.5 ? 'text-caution' : ''}>{(v * 100).toFixed(v < 0.1 ? 1 : 0)} %</span>;
    },
    meta: { right: true },
  },
];

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function Table<T extends object>({ data, columns, onRow, testId }: { data: T[]; columns: ColumnDef<T>[]; onRow?: (row: T) => void; testId: string }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useReactTable({ data, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
  return (
    <table className="num w-full border-collapse text-[12px]" data-testid={testId}>
      <thead>
        {table.getHeaderGroups().map((hg) => (
          <tr key={hg.id}>
            {hg.headers.map((h) => {
              const right = (h.column.columnDef.meta as { right?: boolean } | undefined)?.right;
              const sorted = h.column.getIsSorted();
              return (
                <th key={h.id} className={`sticky top-0 border-b border-rule bg-panel px-1.5 py-1 font-sans text-[11px] font-medium text-ink-muted ${right ? 'text-right' : 'text-left'}`} aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}>
                  {h.column.getCanSort() ? (
                    <button type="button" onClick={h.column.getToggleSortingHandler()} className="hover:text-ink">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      <span className="ml-0.5 inline-block w-2">{sorted === 'asc' ? '▴' : sorted === 'desc' ? '▾' : ''}</span>
                    </button>
                  ) : (
                    flexRender(h.column.columnDef.header, h.getContext())
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} className={`border-b border-rule/50 ${onRow ? 'cursor-pointer hover:bg-sunken' : ''}`} onClick={() => onRow?.(row.original)}>
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={`px-1.5 py-0.5 ${(cell.column.columnDef.meta as { right?: boolean } | undefined)?.right ? 'text-right' : ''}`}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function ReadingsTable() {
  const editor = useEditor();
  const [kind, setKind] = useState<'nets' | 'parts'>('nets');
  const result = useSolveState((s) => s.result);
  const pinNets = useSolveState((s) => s.pinNets);
  const sheet = useEditorState((s) => s.doc);
  const nets = useMemo(() => (result ? netRows(result, pinNets) : []), [result, pinNets]);
  const parts = useMemo(() => (result ? partRows(result, sheet) : []), [result, sheet]);
  if (!result) return <p className="p-4 text-[13px] text-ink-muted">No readings yet: the sheet has not solved. See the Checks tab for why.</p>;
  const rows = kind === 'nets' ? nets : parts;
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(readingsCsv(kind, rows, '\t'));
      notify(`Copied ${rows.length} rows (tab-separated).`);
    } catch {
      notify('The browser did not allow copying; use CSV instead.', 'error');
    }
  };
  const btn = 'rounded border border-rule px-2 py-0.5 text-[12px] hover:bg-sunken';
  return (
    <div className="flex h-full flex-col" data-testid="readings-panel">
      <div className="flex items-center gap-2 border-b border-rule px-3 py-2">
        <div role="tablist" aria-label="Readings of" className="inline-flex rounded border border-rule p-0.5">
          {(['nets', 'parts'] as const).map((k) => (
            <button key={k} role="tab" type="button" aria-selected={kind === k} onClick={() => setKind(k)} className={`rounded-sm px-2 py-0.5 text-[12px] ${kind === k ? 'bg-accent text-accent-ink' : 'text-ink-muted'}`}>
              {k === 'nets' ? 'Nets' : 'Parts'}
            </button>
          ))}
        </div>
        <div className="ml-auto flex gap-1">
          <button type="button" className={btn} onClick={() => void copy()} data-testid="readings-copy">Copy</button>
          <button type="button" className={btn} onClick={() => download(`${(sheet.title ?? 'sheet').replace(/[^\w-]+/g, '_')}-${kind}.csv`, readingsCsv(kind, rows))} data-testid="readings-csv">CSV</button>
        </div>
      </div>
      <div className="min-h-0 flex-1 overflow-auto px-1">
        {kind === 'nets' ? (
          <Table data={nets} columns={netColumns} testId="readings-nets" />
        ) : (
          <Table data={parts} columns={partColumns} onRow={(r) => editor.actions.select({ parts: [r.part] })} testId="readings-parts" />
        )}
      </div>
    </div>
  );
}
