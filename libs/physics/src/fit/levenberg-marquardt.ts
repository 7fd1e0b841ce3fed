/**
 * A Levenberg–Marquardt least-squares solver with an honest convergence report and the
 * parameter covariance from the Jacobian.
 */
import { PHYSICS_DEFAULTS } from '../defaults';
import { choleskySolve, invertSpd } from '../numeric/matrix';

/** Problem given to `levenbergMarquardt`. */
export interface LeastSquaresProblem {
  /** Residual vector at p; may return non-finite values where p is infeasible (step rejected). */
  residuals: (p: readonly number[]) => ArrayLike<number>;
  initial: readonly number[];
  /**
   * The Jacobian of the residuals at p, m x k as k columns (null where it cannot be evaluated);
   * default forward differences of `residuals`.
   */
  jacobian?: ((p: readonly number[]) => Float64Array[] | null) | undefined;
  maxIterations?: number;
  /** Converged when the relative fall of the sum of squares in an accepted step is below this. */
  costTolerance?: number;
  /** Converged when every step component is below this times (|p_i| + this). */
  stepTolerance?: number;
}

/** Result of `levenbergMarquardt`. */
export interface LeastSquaresResult {
  parameters: number[];
  residuals: number[];
  /** Sum of squared residuals. */
  cost: number;
  iterations: number;
  converged: boolean;
  reason: string;
  /** (J^T J)^-1 at the solution, or null when J^T J is singular (parameters not identifiable). */
  unscaledCovariance: number[][] | null;
}

function sumSquares(r: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
  return Number.isFinite(s) ? s : Number.POSITIVE_INFINITY;
}

/** The problem's Jacobian, else forward differences; m x k, column-major as k arrays. */
function jacobian(
  problem: LeastSquaresProblem,
  p: number[],
  r0: ArrayLike<number>,
): Float64Array[] | null {
  if (problem.jacobian) {
    const given = problem.jacobian(p);
    return given?.every((col) => col.every(Number.isFinite)) ? given : null;
  }
  const cols: Float64Array[] = [];
  for (let j = 0; j < p.length; j++) {
    const h = 1e-7 * Math.max(Math.abs(p[j]!), 1e-2);
    const q = p.slice();
    q[j] = p[j]! + h;
    const r = problem.residuals(q);
    const col = new Float64Array(r0.length);
    for (let i = 0; i < r0.length; i++) {
      col[i] = (r[i]! - r0[i]!) / h;
      if (!Number.isFinite(col[i]!)) return null;
    }
    cols.push(col);
  }
  return cols;
}

function normalEquations(
  cols: Float64Array[],
  r: ArrayLike<number>,
): { a: number[][]; g: number[] } {
  const k = cols.length;
  const a = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  const g = new Array<number>(k).fill(0);
  for (let i = 0; i < k; i++) {
    const ci = cols[i]!;
    for (let j = 0; j <= i; j++) {
      const cj = cols[j]!;
      let s = 0;
      for (let m = 0; m < ci.length; m++) s += ci[m]! * cj[m]!;
      a[i]![j] = s;
      a[j]![i] = s;
    }
    let s = 0;
    for (let m = 0; m < ci.length; m++) s += ci[m]! * r[m]!;
    g[i] = s;
  }
  return { a, g };
}

/** Damping below which a step is a Gauss–Newton step to within 1 % of the diagonal. */
const NEAR_GAUSS_NEWTON = 1e-2;

/** The fall of the sum of squares the linearised model predicts for a step: -2 g.d - d.A.d. */
function predictedFall(a: number[][], g: number[], delta: number[]): number {
  let fall = 0;
  for (let i = 0; i < delta.length; i++) {
    let ad = 0;
    for (let j = 0; j < delta.length; j++) ad += a[i]![j]! * delta[j]!;
    fall -= delta[i]! * (2 * g[i]! + ad);
  }
  return fall;
}

/**
 * Minimizes the sum of squared residuals by Levenberg–Marquardt with Marquardt's diagonal
 * scaling: solve (J^T J + lambda diag(J^T J)) delta = -J^T r, accept the step when the sum of
 * squares falls (lambda / 3), otherwise retry with lambda * 4.
 * Convergence is reported only when an accepted step changes the sum of squares by less than
 * `costTolerance` (relative) or the parameters by less than `stepTolerance`, when a rejected
 * step raises it by less than `costTolerance` while the linearised model predicts no larger
 * fall (J. J. Moré, The Levenberg–Marquardt algorithm: implementation and theory, in
 * Numerical Analysis, Springer LNM 630, 105 (1978), the ftol test), or when the gradient vanishes; hitting the
 * iteration cap, a damping overflow or a model that cannot be evaluated is reported as not
 * converged with the reason. Defaults in `PHYSICS_DEFAULTS` (fitMaxIterations,
 * fitCostTolerance, fitStepTolerance).
 * Source: K. Levenberg, Q. Appl. Math. 2, 164 (1944); D. W. Marquardt, J. SIAM 11, 431 (1963).
 */
export function levenbergMarquardt(problem: LeastSquaresProblem): LeastSquaresResult {
  const maxIterations = problem.maxIterations ?? PHYSICS_DEFAULTS.fitMaxIterations;
  const costTol = problem.costTolerance ?? PHYSICS_DEFAULTS.fitCostTolerance;
  const stepTol = problem.stepTolerance ?? PHYSICS_DEFAULTS.fitStepTolerance;
  let p = problem.initial.slice();
  let r = problem.residuals(p);
  let cost = sumSquares(r);
  const finish = (iterations: number, converged: boolean, reason: string): LeastSquaresResult => {
    const cols = Number.isFinite(cost) ? jacobian(problem, p, r) : null;
    const cov = cols ? invertSpd(normalEquations(cols, r).a) : null;
    return {
      parameters: p,
      residuals: Array.from(r),
      cost,
      iterations,
      converged,
      reason,
      unscaledCovariance: cov,
    };
  };
  if (!Number.isFinite(cost))
    return finish(0, false, 'the model cannot be evaluated at the initial parameters');
  let lambda = 1e-3;
  for (let iter = 1; iter <= maxIterations; iter++) {
    const cols = jacobian(problem, p, r);
    if (!cols) return finish(iter, false, 'the Jacobian is not finite at the current parameters');
    const { a, g } = normalEquations(cols, r);
    const gradNorm = Math.max(...g.map(Math.abs));
    if (gradNorm <= 1e-14 * Math.max(cost, 1e-300)) return finish(iter, true, 'gradient vanished');
    let accepted = false;
    while (!accepted) {
      const damped = a.map((row, i) =>
        row.map((v, j) => (i === j ? v * (1 + lambda) + 1e-300 : v)),
      );
      const delta = choleskySolve(
        damped,
        g.map((v) => -v),
      );
      if (delta) {
        const q = p.map((v, i) => v + delta[i]!);
        const rq = problem.residuals(q);
        const cq = sumSquares(rq);
        if (cq <= cost) {
          const relFall = (cost - cq) / Math.max(cost, 1e-300);
          // Both the actual and the predicted fall of a nearly undamped step must be small
          // (MINPACK's ftol test): a heavily damped step lowers the sum of squares little
          // anywhere, and one along a direction the data hardly fix (a level far from the Fermi
          // level) lowers it little without reaching the minimum.
          const atMinimum =
            lambda < NEAR_GAUSS_NEWTON &&
            predictedFall(a, g, delta) <= costTol * Math.max(cost, 1e-300);
          const smallStep = delta.every(
            (d, i) => Math.abs(d) <= stepTol * (Math.abs(p[i]!) + stepTol),
          );
          p = q;
          r = rq;
          cost = cq;
          lambda = Math.max(lambda / 3, 1e-12);
          accepted = true;
          if (relFall < costTol && atMinimum && iter > 1)
            return finish(iter, true, 'relative change of the sum of squares below tolerance');
          if (smallStep) return finish(iter, true, 'parameter step below tolerance');
          continue;
        }
        // At the minimum a step can only trade rounding: when a nearly undamped (Gauss–Newton)
        // step raises the sum of squares by less than the tolerance and the linearised model
        // predicts no larger fall, no step can lower it by more (MINPACK's ftol test; Moré
        // 1978). Without it the damping climbs over many rejected steps until one falls by
        // rounding luck. A heavily damped step predicts a small fall anywhere, so it never counts.
        if (
          iter > 1 &&
          lambda < NEAR_GAUSS_NEWTON &&
          cq - cost <= costTol * cost &&
          predictedFall(a, g, delta) <= costTol * cost
        )
          return finish(iter, true, 'relative change of the sum of squares below tolerance');
      }
      lambda *= 4;
      if (lambda > 1e16) {
        // At a minimum to rounding no step can lower the cost: accept it only if the
        // Gauss–Newton predicted decrease (about sum g_i^2 / a_ii) is itself negligible.
        let predicted = 0;
        for (let i = 0; i < g.length; i++)
          predicted += (g[i]! * g[i]!) / Math.max(a[i]![i]!, 1e-300);
        if (predicted <= 1e-8 * cost) return finish(iter, true, 'at a minimum within rounding');
        return finish(
          iter,
          false,
          'no step lowers the sum of squares (damping exhausted) before the convergence tests were met',
        );
      }
    }
  }
  return finish(maxIterations, false, `iteration limit (${maxIterations}) reached`);
}
