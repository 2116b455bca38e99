import { scoresOf, type ContingencyTable, type Scores } from './contingency';

/** Adds contingency tables cell by cell (scores over many issuances come from the summed table, not from averaged scores). */
export function sumTables(tables: readonly ContingencyTable[]): ContingencyTable {
  const total: ContingencyTable = { hits: 0, falseAlarms: 0, misses: 0, correctNegatives: 0 };
  for (const t of tables) {
    total.hits += t.hits;
    total.falseAlarms += t.falseAlarms;
    total.misses += t.misses;
    total.correctNegatives += t.correctNegatives;
  }
  return total;
}

/** Summed table and its scores per key (a level key, or a hazard key). */
export function aggregateByKey(rows: readonly { key: string; table: ContingencyTable }[]): { key: string; table: ContingencyTable; scores: Scores }[] {
  const byKey = new Map<string, ContingencyTable[]>();
  for (const row of rows) byKey.set(row.key, [...(byKey.get(row.key) ?? []), row.table]);
  return [...byKey.entries()].map(([key, tables]) => {
    const table = sumTables(tables);
    return { key, table, scores: scoresOf(table) };
  });
}

/**
 * On the performance diagram (Roebber 2009), the probability of detection where the CSI
 * isoline `csi` crosses success ratio `successRatio`: from 1/CSI = 1/SR + 1/POD − 1.
 * Null where that isoline does not reach this success ratio.
 */
export function podOnCsiLine(csi: number, successRatio: number): number | null {
  const inverse = 1 / csi - 1 / successRatio + 1;
  if (inverse <= 0) return null;
  const pod = 1 / inverse;
  return pod >= 0 && pod <= 1 ? pod : null;
}
