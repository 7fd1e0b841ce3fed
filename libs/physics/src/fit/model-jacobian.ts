/**
 * The Jacobian of `fitModel`'s ln rho(T) with respect to its fitted coordinates, one neutrality
 * solve per temperature instead of one per coordinate.
 */
import type { ResolvedDoping } from '../semiconductor/dopants';
import type { DopingLogs } from '../semiconductor/neutrality-solve';
import type { CurveTerms, ResolvedModel } from '../semiconductor/resistivity';
import type { LnResistivityGradient } from '../semiconductor/resistivity-gradient';
import { lnResistivityGradientAt } from '../semiconductor/resistivity-gradient';

/** @internal What one set of fitted coordinates resolves to. */
export interface ResolvedParameters {
  doping: ResolvedDoping;
  model: ResolvedModel;
  /** The doping's logarithms, taken once for every temperature. */
  logs: DopingLogs;
}

/** @internal A temperature's shared terms and the last root found there (a warm start). */
export interface CurveAt {
  terms: CurveTerms;
  eta: number;
}

/** Resolved quantities x whose derivatives `lnResistivityGradientAt` gives, in this order. */
const QUANTITIES = [
  'donorDensity',
  'acceptorDensity',
  'donorLevelEv',
  'acceptorLevelEv',
  'donorBoundFraction',
  'acceptorBoundFraction',
] as const;
/** Central-difference step in the coordinates (logs, logits and levels in eV, all of order 1). */
const STEP = 1e-5;

function quantitiesOf(r: ResolvedParameters): number[] {
  return [...QUANTITIES.map((x) => r.doping[x]), Math.log(r.model.mobilityScale)];
}

/**
 * @internal d ln rho(T) / dq at coordinates q, by the chain rule through the resolved doping
 * x(q): d ln rho / dq_j = sum_x (d ln rho / dx) (dx / dq_j). The first factor is analytic at
 * each temperature (`lnResistivityGradientAt`); the second depends on q only (coordinates to
 * densities, the density-dependent levels and bound shares of `ionizeDoping`) and is taken once
 * by central differences with a step of 1e-5, whose error (about 1e-11 relative) is far below
 * that of the forward differences it replaces (about 1e-7). Returns null where q is infeasible;
 * otherwise a function that writes the gradient at T and returns ln rho.
 */
export function lnModelGradient(
  q: readonly number[],
  resolve: (q: readonly number[]) => ResolvedParameters | null,
  resolveUnchecked: (q: readonly number[]) => ResolvedParameters,
  curveAt: (temperatureK: number) => CurveAt,
): ((temperatureK: number, gradient: Float64Array) => number) | null {
  const base = resolve(q);
  if (!base) return null;
  const perCoordinate = q.map((_, j) => {
    const up = q.slice();
    const down = q.slice();
    up[j] = q[j]! + STEP;
    down[j] = q[j]! - STEP;
    const hi = quantitiesOf(resolveUnchecked(up));
    const lo = quantitiesOf(resolveUnchecked(down));
    return Float64Array.from(hi, (v, i) => (v - lo[i]!) / (2 * STEP));
  });
  const at: LnResistivityGradient = {
    lnResistivity: 0,
    eta: 0,
    donorDensity: 0,
    acceptorDensity: 0,
    donorLevelEv: 0,
    acceptorLevelEv: 0,
    donorBoundFraction: 0,
    acceptorBoundFraction: 0,
    lnMobilityScale: 0,
  };
  return (temperatureK, gradient) => {
    const curve = curveAt(temperatureK);
    lnResistivityGradientAt(base.model, base.doping, curve.terms, curve.eta, at, base.logs);
    curve.eta = at.eta;
    for (let j = 0; j < perCoordinate.length; j++) {
      const dx = perCoordinate[j]!;
      gradient[j] =
        at.donorDensity * dx[0]! +
        at.acceptorDensity * dx[1]! +
        at.donorLevelEv * dx[2]! +
        at.acceptorLevelEv * dx[3]! +
        at.donorBoundFraction * dx[4]! +
        at.acceptorBoundFraction * dx[5]! +
        at.lnMobilityScale * dx[6]!;
    }
    return at.lnResistivity;
  };
}
