/**
 * Small dense symmetric positive definite systems: Cholesky solve and inverse.
 */

/** @internal Solves A x = b for symmetric positive definite A by Cholesky; null when not positive definite. */
export function choleskySolve(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const l = a.map((row) => row.map(() => 0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i]![j]!;
      for (let k = 0; k < j; k++) s -= l[i]![k]! * l[j]![k]!;
      if (i === j) {
        if (!(s > 0)) return null;
        l[i]![i] = Math.sqrt(s);
      } else {
        l[i]![j] = s / l[j]![j]!;
      }
    }
  }
  const y = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[i]![k]! * y[k]!;
    y[i] = s / l[i]![i]!;
  }
  const x = new Array<number>(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!;
    for (let k = i + 1; k < n; k++) s -= l[k]![i]! * x[k]!;
    x[i] = s / l[i]![i]!;
  }
  return x;
}

/** @internal Inverse of a symmetric positive definite matrix, or null when singular. */
export function invertSpd(a: number[][]): number[][] | null {
  const n = a.length;
  // Scale to unit diagonal first, so parameters of very different sizes do not fake singularity.
  const d = a.map((row, i) => Math.sqrt(row[i]!));
  if (!d.every((v) => v > 0 && Number.isFinite(v))) return null;
  const scaled = a.map((row, i) => row.map((v, j) => v / (d[i]! * d[j]!)));
  const cols: number[][] = [];
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const x = choleskySolve(scaled, e);
    if (!x) return null;
    cols.push(x);
  }
  const inv = cols.map((_, i) => cols.map((col, j) => col[i]! / (d[i]! * d[j]!)));
  // A condition number beyond ~1e14 leaves no significant digit in the covariance.
  let maxDiag = 0;
  for (let i = 0; i < n; i++) maxDiag = Math.max(maxDiag, cols[i]![i]!);
  return maxDiag > 1e14 ? null : inv;
}
