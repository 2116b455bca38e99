import type { VerificationGrid } from './grid';

/**
 * Practically perfect hindcast: the field a forecaster who knew where the reports would fall
 * would have drawn. Brooks et al. (1998, 19th Conf. on Severe Local Storms, AMS preprints) mark
 * the grid boxes holding at least one report and smooth them with a two-dimensional Gaussian
 * kernel:
 *
 *   p(x) = Σₙ Δ² / (2πσ²) · exp(−|x − xₙ|² / (2σ²))
 *
 * where the sum runs over the marked boxes, Δ is the grid spacing and σ the smoothing length.
 * The factor Δ²/(2πσ²) makes the kernel's sum over an unbounded grid equal to one.
 */
export function gaussianWeight(distanceKm: number, sigmaKm: number, spacingKm: number): number {
  return ((spacingKm * spacingKm) / (2 * Math.PI * sigmaKm * sigmaKm)) * Math.exp(-(distanceKm * distanceKm) / (2 * sigmaKm * sigmaKm));
}

/** Kernel weights beyond this many smoothing lengths are below 4e-6 of the peak and are skipped. */
const KERNEL_CUTOFF_SIGMAS = 5;

/**
 * Smooths the marked cells (value 1) into a probability-like field, capped at 1.
 * `marked` holds one flag per grid cell (same indexing as `grid.cells`).
 */
export function practicallyPerfectField(grid: VerificationGrid, marked: ArrayLike<boolean | number>, sigmaKm: number): Float64Array {
  const field = new Float64Array(grid.cells.length);
  const reach = Math.ceil((KERNEL_CUTOFF_SIGMAS * sigmaKm) / grid.spacingKm);
  // The kernel depends only on the offset in cells: tabulate it once.
  const width = 2 * reach + 1;
  const kernel = new Float64Array(width * width);
  for (let dr = -reach; dr <= reach; dr++) {
    for (let dc = -reach; dc <= reach; dc++) kernel[(dr + reach) * width + (dc + reach)] = gaussianWeight(grid.spacingKm * Math.hypot(dr, dc), sigmaKm, grid.spacingKm);
  }
  for (let index = 0; index < marked.length; index++) {
    if (!marked[index]) continue;
    const row = Math.floor(index / grid.columns);
    const column = index % grid.columns;
    for (let r = Math.max(0, row - reach); r <= Math.min(grid.rows - 1, row + reach); r++) {
      const kernelRow = (r - row + reach) * width + reach - column;
      const fieldRow = r * grid.columns;
      for (let c = Math.max(0, column - reach); c <= Math.min(grid.columns - 1, column + reach); c++) {
        field[fieldRow + c] = (field[fieldRow + c] ?? 0) + (kernel[kernelRow + c] ?? 0);
      }
    }
  }
  for (let i = 0; i < field.length; i++) field[i] = grid.cells[i] ? Math.min(1, field[i] ?? 0) : 0;
  return field;
}
