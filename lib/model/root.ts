/**
 * Root of a continuous f on [a, b] with f(a)·f(b) ≤ 0, by the Illinois variant of regula
 * falsi (Dowell & Jarratt 1971), falling back to bisection when it stalls. Stops when the
 * bracket is narrower than `tol` (absolute) or f is exactly zero.
 * Throws a RangeError when the end values do not bracket a root.
 * Example: `bracketedRoot(x => x * x - 2, 0, 2)` → 1.41421356237…
 */
export function bracketedRoot(f: (x: number) => number, a: number, b: number, tol = 1e-14 * Math.max(1, Math.abs(b))): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb) || Number.isNaN(fa) || Number.isNaN(fb)) {
    throw new RangeError(`bracketedRoot: f(${a}) = ${fa} and f(${b}) = ${fb} do not bracket a root`);
  }
  let side = 0;
  for (let i = 0; i < 200 && Math.abs(b - a) > tol; i++) {
    let x = (a * fb - b * fa) / (fb - fa);
    // Bisect every fifth step and whenever the secant leaves the bracket: guarantees progress.
    if (!(x > Math.min(a, b) && x < Math.max(a, b)) || i % 5 === 4) x = 0.5 * (a + b);
    const fx = f(x);
    if (fx === 0) return x;
    if (Math.sign(fx) === Math.sign(fb)) {
      b = x;
      fb = fx;
      if (side === -1) fa *= 0.5;
      side = -1;
    } else {
      a = x;
      fa = fx;
      if (side === 1) fb *= 0.5;
      side = 1;
    }
  }
  return Math.abs(fa) < Math.abs(fb) ? a : b;
}
