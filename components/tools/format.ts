/** Numbers for the calculators: two decimals under 10, one under 100, whole above. */
export function fmt(x: number): string {
  if (!Number.isFinite(x)) return '—';
  const a = Math.abs(x);
  const d = a < 10 ? 2 : a < 100 ? 1 : 0;
  return x.toFixed(d);
}
