/**
 * Largest-Triangle-Three-Buckets downsampling [pub: S. Steinarsson, "Downsampling Time Series for Visual
 * Representation", University of Iceland, 2013]: keeps the first and last points and, from each bucket, the
 * point that spans the largest triangle with its neighbours, so peaks and steps survive.
 */
export function lttb<T>(points: readonly T[], threshold: number, x: (p: T) => number, y: (p: T) => number): T[] {
  if (threshold >= points.length || threshold < 3) return [...points];
  const sampled: T[] = [points[0]!];
  const every = (points.length - 2) / (threshold - 2);
  let a = 0;
  for (let i = 0; i < threshold - 2; i++) {
    const nextStart = Math.floor((i + 1) * every) + 1;
    const nextEnd = Math.min(Math.floor((i + 2) * every) + 1, points.length);
    let avgX = 0;
    let avgY = 0;
    for (let j = nextStart; j < nextEnd; j++) {
      avgX += x(points[j]!);
      avgY += y(points[j]!);
    }
    const n = Math.max(1, nextEnd - nextStart);
    avgX /= n;
    avgY /= n;
    const start = Math.floor(i * every) + 1;
    const end = Math.floor((i + 1) * every) + 1;
    const ax = x(points[a]!);
    const ay = y(points[a]!);
    let best = start;
    let bestArea = -1;
    for (let j = start; j < end; j++) {
      const area = Math.abs((ax - avgX) * (y(points[j]!) - ay) - (ax - x(points[j]!)) * (avgY - ay));
      if (area > bestArea) {
        bestArea = area;
        best = j;
      }
    }
    sampled.push(points[best]!);
    a = best;
  }
  sampled.push(points[points.length - 1]!);
  return sampled;
}

/**
 * LTTB for a series with missing values: a missing value is never scored (as 0 or anything else). A gap at least
 * one output bucket long is kept as one empty point (its first), so a chart breaks its line there; shorter gaps are
 * invisible at the output's resolution and are left out. The runs between kept gaps share the remaining points in
 * proportion to their length (at least one each) and are downsampled on their own, so a run never reaches across
 * a gap. At or below the threshold the input comes back unchanged.
 */
export function lttbKeepingGaps<T>(points: readonly T[], threshold: number, x: (p: T) => number, y: (p: T) => number | null): T[] {
  const n = points.length;
  if (threshold >= n || threshold < 3) return [...points];
  const missing = (p: T) => {
    const v = y(p);
    return v === null || !Number.isFinite(v);
  };
  const bucket = n / threshold;
  const pieces: ({ gap: T } | { run: T[] })[] = [];
  for (let i = 0; i < n;) {
    let j = i;
    if (missing(points[i]!)) {
      while (j < n && missing(points[j]!)) j++;
      if (j - i >= bucket) pieces.push({ gap: points[i]! });
    } else {
      while (j < n && !missing(points[j]!)) j++;
      const last = pieces.at(-1);
      if (last && 'run' in last) last.run.push(...points.slice(i, j));
      else pieces.push({ run: points.slice(i, j) });
    }
    i = j;
  }
  const runs = pieces.filter((p): p is { run: T[] } => 'run' in p).map((p) => p.run);
  const gaps = pieces.length - runs.length;
  const budget = threshold - gaps;
  if (budget < runs.length) {
    // Gaps alternate faster than the output can show: every n/threshold-th point, empty ones as they are.
    return Array.from({ length: threshold }, (_, k) => points[Math.floor((k * (n - 1)) / (threshold - 1))]!);
  }
  const total = runs.reduce((s, r) => s + r.length, 0);
  const alloc = runs.map((r) => Math.min(r.length, Math.max(1, Math.floor((budget * r.length) / total))));
  let sum = alloc.reduce((s, a) => s + a, 0);
  while (sum > budget) {
    const k = alloc.indexOf(Math.max(...alloc));
    alloc[k]!--;
    sum--;
  }
  while (sum < budget) {
    let k = -1;
    for (let r = 0; r < runs.length; r++) if (alloc[r]! < runs[r]!.length && (k < 0 || runs[r]!.length / alloc[r]! > runs[k]!.length / alloc[k]!)) k = r;
    if (k < 0) break;
    alloc[k]!++;
    sum++;
  }
  const value = (p: T) => y(p) as number;
  const out: T[] = [];
  let r = 0;
  for (const piece of pieces) {
    if ('gap' in piece) {
      out.push(piece.gap);
      continue;
    }
    const run = piece.run;
    const k = alloc[r++]!;
    if (k >= run.length) out.push(...run);
    else if (k === 1) out.push(run[run.length >> 1]!);
    else if (k === 2) out.push(run[0]!, run[run.length - 1]!);
    else out.push(...lttb(run, k, x, value));
  }
  return out;
}
