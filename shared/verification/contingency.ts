/**
 * The 2×2 contingency table of a yes/no forecast against yes/no observations over grid cells,
 * and the scores read from it. Definitions: Wilks, Statistical Methods in the Atmospheric
 * Sciences (3rd ed. 2011), section 8.2 (hit rate / POD, false alarm ratio, threat score / CSI,
 * bias); success ratio = 1 − FAR as used on the performance diagram (Roebber 2009, Wea.
 * Forecasting 24).
 */
export interface ContingencyTable {
  /** forecast yes, observed yes */
  hits: number;
  /** forecast yes, observed no */
  falseAlarms: number;
  /** forecast no, observed yes */
  misses: number;
  /** forecast no, observed no */
  correctNegatives: number;
}

export interface Scores {
  /** probability of detection a/(a+c); null when nothing was observed */
  pod: number | null;
  /** success ratio a/(a+b) = 1 − FAR; null when nothing was forecast */
  successRatio: number | null;
  /** critical success index a/(a+b+c); null when nothing was forecast or observed */
  csi: number | null;
  /** frequency bias (a+b)/(a+c); null when nothing was observed */
  bias: number | null;
}

/** Counts the table over paired forecast/observed flags (one pair per grid cell). */
export function tabulate(forecast: ArrayLike<boolean | number>, observed: ArrayLike<boolean | number>): ContingencyTable {
  if (forecast.length !== observed.length) throw new RangeError('forecast and observed must have the same length');
  const table: ContingencyTable = { hits: 0, falseAlarms: 0, misses: 0, correctNegatives: 0 };
  for (let i = 0; i < forecast.length; i++) {
    const f = Boolean(forecast[i]);
    const o = Boolean(observed[i]);
    if (f && o) table.hits++;
    else if (f) table.falseAlarms++;
    else if (o) table.misses++;
    else table.correctNegatives++;
  }
  return table;
}

const ratio = (numerator: number, denominator: number): number | null => (denominator === 0 ? null : numerator / denominator);

/** The four scores of the performance diagram from a contingency table. */
export function scoresOf(table: ContingencyTable): Scores {
  const { hits: a, falseAlarms: b, misses: c } = table;
  return {
    pod: ratio(a, a + c),
    successRatio: ratio(a, a + b),
    csi: ratio(a, a + b + c),
    bias: ratio(a + b, a + c),
  };
}
