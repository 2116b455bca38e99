import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { clsx } from 'clsx';
import { ArrowDown, ArrowUp, ArrowUpDown, Trash2 } from 'lucide-react';
import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import type { SoundingListQuery, SoundingSummary } from '../../../../shared/contracts/soundings';
import { soundingSortKeys } from '../../../../shared/contracts/soundings';
import type { UnitFormatters } from '../../../hooks/use-units';
import { LIBRARY_COLUMNS_STORAGE_KEY, parseLibraryColumns, toggleLibraryColumn } from '../utils/library-columns';
import { figureDefinitions, libraryFigureKeys, type FigureKey } from '../utils/sounding-figures';
import { formatValidTimeLocal, formatValidTimeUtc } from '../utils/valid-time';
import { LibraryColumnChooser } from './library-column-chooser';
import { ModifiedBadge } from './modified-badge';

type SortKey = SoundingListQuery['sort'];

function isSortKey(value: string): value is SortKey {
  return (soundingSortKeys as readonly string[]).includes(value);
}

interface SoundingsTableProps {
  soundings: SoundingSummary[];
  sort: SortKey;
  order: SoundingListQuery['order'];
  onSortChange: (sort: SortKey, order: SoundingListQuery['order']) => void;
  units: UnitFormatters;
  timeZone: string;
  canDelete: (sounding: SoundingSummary) => boolean;
  onDelete: (sounding: SoundingSummary) => void;
  busy: boolean;
}

const column = createColumnHelper<SoundingSummary>();

/**
 * One server page of soundings. Sorting is done by the server: clicking a heading asks for a
 * new page (ascending, then descending), so the table never sorts only the rows it happens to hold.
 */
export function SoundingsTable({ soundings, sort, order, onSortChange, units, timeZone, canDelete, onDelete, busy }: SoundingsTableProps) {
  // Extra figure columns (hazard ingredients…), remembered in this browser.
  const [extraKeys, setExtraKeys] = useState<FigureKey[]>(() => parseLibraryColumns(readStored()));
  const toggleColumn = (key: FigureKey, on: boolean) => {
    const next = toggleLibraryColumn(extraKeys, key, on);
    setExtraKeys(next);
    writeStored(JSON.stringify(next));
  };
  const columns = useMemo(
    () => [
      column.accessor('stationId', {
        id: 'stationId',
        header: 'Station',
        cell: ({ row }) => {
          const sounding = row.original;
          return (
            <div className="min-w-28">
              <Link to={`/soundings/${sounding.id}`} className="font-semibold text-accent hover:underline">
                {sounding.stationId}
              </Link>
              {sounding.stationName ? <span className="block max-w-48 truncate text-[12px] text-ink-muted">{sounding.stationName}</span> : null}
              {sounding.modificationName !== null ? (
                <span className="mt-0.5 block">
                  <ModifiedBadge name={sounding.modificationName} />
                </span>
              ) : null}
            </div>
          );
        },
      }),
      column.accessor('validTime', {
        id: 'validTime',
        header: 'Valid time',
        cell: ({ getValue }) => (
          <div className="whitespace-nowrap">
            <span className="block">{formatValidTimeUtc(getValue())}</span>
            <span className="block text-[12px] text-ink-muted">{formatValidTimeLocal(getValue(), timeZone)}</span>
          </div>
        ),
      }),
      column.accessor('source', {
        id: 'source',
        header: 'Source',
        cell: ({ getValue }) => (
          <span className={clsx('rounded px-1.5 py-0.5 text-[12px] font-semibold', getValue() === 'observed' ? 'bg-accent-soft text-accent-strong' : 'bg-sunken text-ink-muted')}>
            {getValue() === 'observed' ? 'Observed' : 'Model'}
          </span>
        ),
      }),
      ...[...libraryFigureKeys, ...extraKeys].map((key) =>
        column.accessor((sounding) => sounding.figures[key], {
          id: key,
          header: () => {
            const unit = figureDefinitions[key].unit(units);
            return (
              <span className="flex flex-col items-end leading-tight">
                <span>{figureDefinitions[key].label}</span>
                {unit ? <span className="font-normal normal-case text-ink-faint">{unit}</span> : null}
              </span>
            );
          },
          meta: { numeric: true, title: figureDefinitions[key].name },
          cell: ({ getValue }) => figureDefinitions[key].value(getValue(), units),
        }),
      ),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          canDelete(row.original) ? (
            <Button size="sm" variant="ghost" aria-label={`Delete ${row.original.stationId} ${formatValidTimeUtc(row.original.validTime)}`} onClick={() => onDelete(row.original)} disabled={busy}>
              <Trash2 aria-hidden className="size-3.5" />
            </Button>
          ) : null,
      }),
    ],
    [units, timeZone, canDelete, onDelete, busy, extraKeys],
  );

  const sorting: SortingState = [{ id: sort, desc: order === 'desc' }];

  // TanStack Table keeps its own instance; the compiler skips memoising this component, as intended.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: soundings,
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    getRowId: (sounding) => sounding.id,
    getCoreRowModel: getCoreRowModel(),
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first && isSortKey(first.id)) onSortChange(first.id, first.desc ? 'desc' : 'asc');
    },
  });

  return (
    <div className="space-y-2">
      <div className="flex justify-end">
        <LibraryColumnChooser chosen={extraKeys} onToggle={toggleColumn} units={units} />
      </div>
      <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Soundings, one server page; column headings sort</caption>
          <thead className="border-b border-line bg-sunken text-[12px] font-semibold tracking-wide text-ink-muted">
            {table.getHeaderGroups().map((headerGroup) => (
              <tr key={headerGroup.id}>
                {headerGroup.headers.map((header) => {
                  const sortable = isSortKey(header.column.id);
                  const active = sort === header.column.id;
                  const meta = header.column.columnDef.meta;
                  const numeric = meta?.numeric === true;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      title={meta?.title}
                      aria-sort={active ? (order === 'asc' ? 'ascending' : 'descending') : undefined}
                      className={clsx('px-2.5 py-2 whitespace-nowrap align-bottom', numeric && 'text-right')}
                    >
                      {sortable ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={clsx('inline-flex items-center gap-1 hover:text-ink', active && 'text-ink', numeric && 'flex-row-reverse')}
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          {active ? (
                            order === 'asc' ? (
                              <ArrowUp aria-hidden className="size-3" />
                            ) : (
                              <ArrowDown aria-hidden className="size-3" />
                            )
                          ) : (
                            <ArrowUpDown aria-hidden className="size-3 opacity-40" />
                          )}
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-line">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className={clsx('align-top hover:bg-sunken/50', row.original.modificationName !== null && 'bg-warning-soft/30')}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={clsx('px-2.5 py-2', cell.column.columnDef.meta?.numeric === true && 'text-right whitespace-nowrap')}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

/** The saved extra columns; null where storage is unavailable (private mode, tests without it). */
function readStored(): string | null {
  try {
    return globalThis.localStorage.getItem(LIBRARY_COLUMNS_STORAGE_KEY);
  } catch {
    return null;
  }
}

function writeStored(value: string): void {
  try {
    globalThis.localStorage.setItem(LIBRARY_COLUMNS_STORAGE_KEY, value);
  } catch {
    // Not remembered in this browser; the columns still show until the page is left.
  }
}
