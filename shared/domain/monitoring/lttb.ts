/**
 * Largest-Triangle-Three-Buckets downsampling [pub: S. Steinarsson, "Downsampling Time Series for Visual
 * Representation", University of Iceland, 2013]: keeps the first and last points and, from each bucket, the
 * point that spans the largest triangle with its neighbours, so peaks and steps survive.
 */
export function lttb<T>(points: readonly T[], threshold: number, x: (p: T) => number, y: (p: T) => number): T[] {
  if (threshold >= points.length || threshold < 3) return [...points];
  const sampled: T[] = [points[0]];
  const every = (points.length - 2) / (threshold - 2);
  let a = 0;
  for (let i = 0; i < threshold - 2; i++) {
    const nextStart = Math.floor((i + 1) * every) + 1;
    const nextEnd = Math.min(Math.floor((i + 2) * every) + 1, points.length);
    let avgX = 0;
    let avgY = 0;
    for (let j = nextStart; j < nextEnd; j++) {
      avgX += x(points[j]);
      avgY += y(points[j]);
    }
    const n = Math.max(1, nextEnd - nextStart);
    avgX /= n;
    avgY /= n;
    const start = Math.floor(i * every) + 1;
    const end = Math.floor((i + 1) * every) + 1;
    const ax = x(points[a]);
    const ay = y(points[a]);
    let best = start;
    let bestArea = -1;
    for (let j = start; j < end; j++) {
      const area = Math.abs((ax - avgX) * (y(points[j]) - ay) - (ax - x(points[j])) * (avgY - ay));
      if (area > bestArea) {
        bestArea = area;
        best = j;
      }
    }
    sampled.push(points[best]);
    a = best;
  }
  sampled.push(points[points.length - 1]);
  return sampled;
}
