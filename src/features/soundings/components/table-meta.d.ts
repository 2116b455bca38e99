import type { RowData } from '@tanstack/react-table';

declare module '@tanstack/react-table' {
  /** Column metadata the soundings table reads: right-aligned numbers and a full name for the heading. */
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    numeric?: boolean;
    title?: string;
  }
}
