/** Axis helpers for our charts: "nice" tick steps (1, 2, 2.5, 5 × 10ⁿ) and linear scales. */

export function niceStep(span: number, targetTicks: number): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, targetTicks);
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  const f = raw / mag;
  const nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 2.5 ? 2.5 : f <= 5 ? 5 : 10;
  return nice * mag;
}

/** A domain widened to whole steps, and the ticks inside it. */
export function niceDomain(min: number, max: number, targetTicks = 5): { min: number; max: number; ticks: number[] } {
  let lo = min;
  let hi = max;
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return { min: 0, max: 1, ticks: [0, 1] };
  if (hi - lo < 1e-9) {
    const pad = Math.abs(lo) > 1 ? Math.abs(lo) * 0.05 : 1;
    lo -= pad;
    hi += pad;
  }
  const step = niceStep(hi - lo, targetTicks);
  const nlo = Math.floor(lo / step + 1e-9) * step;
  const nhi = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = nlo; v <= nhi + step * 1e-6; v += step) ticks.push(Number(v.toPrecision(12)));
  return { min: nlo, max: nhi, ticks };
}

export function linearScale(d0: number, d1: number, r0: number, r1: number) {
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  return (v: number) => r0 + (v - d0) * k;
}

/** Tick text with just the decimals the step needs (2.5 → one decimal, 50 → none). */
export function tickFormatter(ticks: readonly number[]): (v: number) => string {
  const step = ticks.length > 1 ? Math.abs(ticks[1] - ticks[0]) : 1;
  const decimals = step >= 1 ? (Number.isInteger(step) ? 0 : 1) : Math.min(6, Math.ceil(-Math.log10(step) - 1e-9) + (Number.isInteger(step * Math.pow(10, Math.ceil(-Math.log10(step)))) ? 0 : 1));
  return (v: number) => {
    const s = v.toFixed(decimals);
    return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s.replace('-', '−');
  };
}
