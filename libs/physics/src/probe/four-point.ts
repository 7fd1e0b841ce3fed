/**
 * Collinear four-point probe: sheet resistance and resistivity with the finite-thickness and
 * finite-diameter corrections.
 */
import { PhysicsInputError } from '../errors';
import { requireFiniteNumber, requireObject, requirePositive } from '../validate';

/** pi / ln 2 = 4.5324: the thin infinite-sheet factor of the collinear four-point probe. */
export const THIN_SHEET_FACTOR = Math.PI / Math.LN2;

/** Smallest slice diameter accepted, in probe spacings (the correction diverges near sqrt 3). */
export const MIN_DIAMETER_SPACINGS = 3;

/**
 * Direct terms of the image series before the Euler–Maclaurin tail takes over: at least 64, and
 * enough to reach 2 n t/s = 8, where the tail's derivative corrections are negligible.
 */
const MIN_DIRECT_TERMS = 64;
const MAX_DIRECT_TERMS = 200_000;

function imageTerm(u: number): number {
  return 1 / Math.sqrt(1 + u * u) - 1 / Math.sqrt(4 + u * u);
}

function imageTermDerivative(u: number): number {
  return -u / Math.pow(1 + u * u, 1.5) + u / Math.pow(4 + u * u, 1.5);
}

/**
 * Exact finite-thickness correction of a slab on an insulating base, relative to the thin-sheet
 * formula: rho = (pi / ln 2) t (V/I) * F(t/s).
 *
 * Formula (method of images, Valdes 1954; Smits 1958): with tau = t/s and both faces insulating,
 *   rho = 2 pi s (V/I) / S(tau),  S = 1 + 4 sum_{n>=1} [1/sqrt(1 + (2 n tau)^2) - 1/sqrt(4 + (2 n tau)^2)]
 *   F = 2 ln 2 / (tau S(tau))     (F -> 1 for a thin sheet, F -> 2 ln 2 / tau for a thick block)
 * The series is summed directly up to 2 n tau = 8 (at least 64 terms) and its tail by Euler–Maclaurin with the closed-form
 * integral (asinh differences), so it is exact to about 1e-12 for any thickness.
 * Source: L. B. Valdes, Proc. IRE 42, 420 (1954); F. M. Smits, Bell Syst. Tech. J. 37, 711 (1958).
 *
 * @param thicknessOverSpacing t/s (> 0)
 * @example finiteThicknessFactor(1) // 0.9215
 */
export function finiteThicknessFactor(thicknessOverSpacing: number): number {
  const tau = requirePositive(
    'finiteThicknessFactor',
    'thicknessOverSpacing',
    thicknessOverSpacing,
  );
  return cachedThicknessFactor(tau);
}

/**
 * Geometry factors already computed, keyed by the exact ratios t/s and d/s. A sweep converts
 * thousands of readings with one geometry, and the thickness factor sums at least 64 image
 * terms, so repeating it per reading dominated the conversion. A cached value is the number the
 * computation returned for that exact key, so results are bit-for-bit those of the uncached
 * path. Each map is bounded: when full it is emptied and refilled.
 */
const GEOMETRY_CACHE_LIMIT = 256;
const thicknessFactorCache = new Map<number, number>();
const diameterFactorCache = new Map<number, number>();

function remember(cache: Map<number, number>, key: number, value: number): number {
  if (cache.size >= GEOMETRY_CACHE_LIMIT) cache.clear();
  cache.set(key, value);
  return value;
}

/** F(t/s) through the cache (tau already checked positive). */
function cachedThicknessFactor(tau: number): number {
  return (
    thicknessFactorCache.get(tau) ??
    remember(thicknessFactorCache, tau, thicknessFactorUnchecked(tau))
  );
}

/** C(d/s) / (pi / ln 2) through the cache (d/s already checked to be at least about 3). */
function cachedDiameterFactor(diameterOverSpacing: number): number {
  return (
    diameterFactorCache.get(diameterOverSpacing) ??
    remember(diameterFactorCache, diameterOverSpacing, diameterFactorUnchecked(diameterOverSpacing))
  );
}

/**
 * @internal The geometry factors computed afresh, bypassing the cache (for tests comparing the
 * cached path with the computation).
 */
export function uncachedGeometryFactors(
  thicknessOverSpacing: number,
  diameterOverSpacing?: number,
): { thicknessFactor: number; diameterFactor: number } {
  return {
    thicknessFactor: thicknessFactorUnchecked(thicknessOverSpacing),
    diameterFactor:
      diameterOverSpacing === undefined ? 1 : diameterFactorUnchecked(diameterOverSpacing),
  };
}

/** @internal Empties the geometry-factor cache (tests). */
export function clearGeometryFactorCache(): void {
  thicknessFactorCache.clear();
  diameterFactorCache.clear();
}

function diameterFactorUnchecked(diameterOverSpacing: number): number {
  const r = Math.max(MIN_DIAMETER_SPACINGS, diameterOverSpacing);
  return Math.LN2 / (Math.LN2 + Math.log((r * r + 3) / (r * r - 3)));
}

function thicknessFactorUnchecked(tau: number): number {
  const h = 2 * tau;
  const terms = Math.min(MAX_DIRECT_TERMS, Math.max(MIN_DIRECT_TERMS, Math.ceil(8 / h)));
  let sum = 0;
  for (let n = 1; n <= terms; n++) sum += imageTerm(n * h);
  // Tail sum_{n > N} f(n) = integral_N^inf f - f(N)/2 - f'(N)/12 + ..., f(x) = imageTerm(h x).
  const uN = terms * h;
  const integral = (Math.LN2 - Math.asinh(uN) + Math.asinh(uN / 2)) / h;
  const tail = integral - imageTerm(uN) / 2 - (h * imageTermDerivative(uN)) / 12;
  const s = 1 + 4 * (sum + tail);
  return (2 * Math.LN2) / (tau * s);
}

/**
 * Finite circular slice correction, probes centred: C(d/s) = pi / (ln 2 + ln[((d/s)^2 + 3) /
 * ((d/s)^2 - 3)]), so R_s = C V/I (tends to pi / ln 2 = 4.5324 as d/s grows).
 * Source: F. M. Smits, Bell Syst. Tech. J. 37, 711 (1958).
 *
 * @param diameterOverSpacing d/s (at least 3)
 * @returns C(d/s)
 * @example circularSliceFactor(10) // 4.1712
 */
export function circularSliceFactor(diameterOverSpacing: number): number {
  const r = requirePositive('circularSliceFactor', 'diameterOverSpacing', diameterOverSpacing);
  if (r < MIN_DIAMETER_SPACINGS) {
    throw new PhysicsInputError(
      'circularSliceFactor',
      'diameterOverSpacing',
      `requires diameterOverSpacing of at least 3, got ${r}`,
    );
  }
  return Math.PI / (Math.LN2 + Math.log((r * r + 3) / (r * r - 3)));
}

/** Result of `fourPointProbe`. */
export interface FourPointProbeResult {
  sheetResistanceOhmSq: number;
  resistivityOhmCm: number;
  /** Exact finite-thickness correction F(t/s) (1 for a thin sheet). */
  thicknessFactor: number;
  /** C(d/s) / (pi / ln 2) (1 for a large slice or when no diameter is given). */
  diameterFactor: number;
}

/**
 * Sheet resistance and resistivity from a collinear, equally spaced four-point probe reading.
 *
 * Formula:
 *   diameterFactor = C(d/s) / (pi/ln 2)  (see `circularSliceFactor`; 1 without a diameter)
 *   sheetResistanceOhmSq = (pi/ln 2) * diameterFactor * V/I
 *   thicknessFactor = F(t/s)  (see `finiteThicknessFactor`)
 *   resistivityOhmCm = sheetResistanceOhmSq * t * thicknessFactor
 * Assumptions: probes collinear, equal spacing s, centred on the slice, insulating base,
 * homogeneous material; the two corrections are applied as independent factors (exact each on
 * its own, the usual practice when both apply).
 * Performance: both factors depend only on t/s and d/s and are memoised per exact ratio (see
 * `GEOMETRY_CACHE_LIMIT`), so a sweep with one geometry sums the image series once; results are
 * identical to computing them on every call.
 * Source: Valdes 1954, Proc. IRE 42, 420; Smits 1958, Bell Syst. Tech. J. 37, 711.
 *
 * @param input voltageV (V), currentA (A, non-zero), spacingCm, thicknessCm, optional diameterCm
 *   (at least 3 spacings)
 * @example fourPointProbe({ voltageV: 0.01, currentA: 0.001, spacingCm: 0.1, thicknessCm: 0.05 })
 *   // { sheetResistanceOhmSq: 45.324, resistivityOhmCm: 2.2602, thicknessFactor: 0.99736, diameterFactor: 1 }
 */
export function fourPointProbe(input: {
  voltageV: number;
  currentA: number;
  spacingCm: number;
  thicknessCm: number;
  diameterCm?: number;
}): FourPointProbeResult {
  const fn = 'fourPointProbe';
  const o = requireObject(fn, 'input', input);
  const ratio = voltageOverCurrent(fn, o);
  const s = requirePositive(fn, 'spacingCm', o['spacingCm']);
  const t = requirePositive(fn, 'thicknessCm', o['thicknessCm']);
  let diameterFactor = 1;
  if (o['diameterCm'] !== undefined) {
    const d = requirePositive(fn, 'diameterCm', o['diameterCm']);
    if (d < MIN_DIAMETER_SPACINGS * s * (1 - 1e-12)) {
      throw new PhysicsInputError(
        fn,
        'diameterCm',
        `requires diameterCm of at least 3 probe spacings (${3 * s} cm), got ${d}`,
      );
    }
    diameterFactor = cachedDiameterFactor(d / s);
  }
  const thicknessFactor = cachedThicknessFactor(t / s);
  const sheetResistanceOhmSq = THIN_SHEET_FACTOR * diameterFactor * ratio;
  return {
    sheetResistanceOhmSq,
    resistivityOhmCm: sheetResistanceOhmSq * t * thicknessFactor,
    thicknessFactor,
    diameterFactor,
  };
}

/** @internal V/I with checks: finite voltage, non-zero finite current, positive ratio. */
export function voltageOverCurrent(fn: string, o: Record<string, unknown>): number {
  const v = requireFiniteNumber(fn, 'voltageV', o['voltageV']);
  const i = requireFiniteNumber(fn, 'currentA', o['currentA']);
  if (i === 0) throw new PhysicsInputError(fn, 'currentA', 'requires a non-zero currentA, got 0');
  const ratio = v / i;
  if (!(ratio > 0) || !Number.isFinite(ratio)) {
    throw new PhysicsInputError(
      fn,
      'voltageV and currentA',
      `requires voltageV and currentA of the same sign and non-zero, got ${v} V and ${i} A`,
    );
  }
  return ratio;
}
