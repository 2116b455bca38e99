/** Maps a value in [0, 1] onto a pixel range (the charts' only scale: scores are ratios). */
export function unitScale(range: [number, number]) {
  return (value: number) => range[0] + (range[1] - range[0]) * Math.min(1, Math.max(0, value));
}
