/** Small timing helpers for the benchmarks (wall-clock ms). */
export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Runs `f` `n` times (after one warm-up) and returns the median and minimum ms. */
export function time<T>(f: () => T, n = 7): { median: number; min: number; last: T } {
  let last = f();
  const xs: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = performance.now();
    last = f();
    xs.push(performance.now() - t);
  }
  return { median: median(xs), min: Math.min(...xs), last };
}

export const ms = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} ms`;
export const mib = (bytes: number) => `${(bytes / 2 ** 20).toFixed(1)} MiB`;
