/**
 * Edge correction of a collinear four-point probe near the straight, non-conducting edge of a
 * thin sheet, by the method of images.
 */
import { PhysicsInputError } from '../errors';
import { requireNonNegative, requireObject, requireOneOf, requirePositive } from '../validate';

/** How the probe line lies against the edge. */
export const PROBE_ORIENTATIONS = ['perpendicular', 'parallel'] as const;
/** `perpendicular`: the probe line points at the edge; `parallel`: it runs along the edge. */
export type ProbeOrientation = (typeof PROBE_ORIENTATIONS)[number];

/**
 * Potential difference V23 of a thin sheet, in units of I R_s / (2 pi), between probes 2 and 3
 * of a collinear line with probes at x = 0, 1, 2, 3 (in spacings; current +I in at 1, out at
 * 4), from the real sources and, when `withImages`, their images in the edge.
 */
function edgeVoltage(
  orientation: ProbeOrientation,
  distanceOverSpacing: number,
  withImages: boolean,
): number {
  const d = distanceOverSpacing;
  // Real source (+1 at x=0, -1 at x=3) seen from probes 2 (x=1) and 3 (x=2): 2 ln 2.
  let v = 2 * Math.LN2;
  if (!withImages) return v;
  if (orientation === 'perpendicular') {
    // Edge at x = -d; images of the same sign at x = -2d (source +1) and -2d - 3 (source -1).
    // Each source q at distance r adds -q ln r to the potential: V23 = phi2 - phi3.
    const img = (x: number, q: number) =>
      -q * (Math.log(Math.abs(1 - x)) - Math.log(Math.abs(2 - x)));
    v += img(-2 * d, 1) + img(-2 * d - 3, -1);
  } else {
    // Edge parallel to the line at distance d: images at the same x, 2d across.
    const h2 = 4 * d * d;
    const img = (x: number, q: number) =>
      -0.5 * q * (Math.log((1 - x) ** 2 + h2) - Math.log((2 - x) ** 2 + h2));
    v += img(0, 1) + img(3, -1);
  }
  return v;
}

/**
 * Edge factor of a collinear, equally spaced four-point probe on a thin sheet near a straight,
 * non-conducting edge: the ratio of the voltage measured to the voltage the same sheet gives
 * far from any edge, so the corrected sheet resistance is R_s = (pi / ln 2) (V / I) / factor.
 *
 * Formula (method of images; a non-conducting edge mirrors each current source with the same
 * sign, the 2-D potential of a source being -(I R_s / 2 pi) ln r): with probes 1..4 at spacing
 * s and d the distance from the edge to the nearest probe (perpendicular) or to the probe line
 * (parallel), in units of s (delta = d/s),
 *   perpendicular: factor = 1 + [ln((2 delta + 2) / (2 delta + 1))
 *                                 - ln((2 delta + 5) / (2 delta + 4))] / (2 ln 2)
 *   parallel:      factor = 1 + ln[((2 delta)^2 + 4) / ((2 delta)^2 + 1)] / (2 ln 2)
 *                  (source and sink images add equal terms), equal to 2 for a line on the
 *                  edge (delta = 0), where each image coincides with its source.
 * Both factors are 1 far from the edge (delta -> infinity). Perpendicular to the edge the
 * factor rises to 1.3390 when the outer probe touches the edge (delta = 0).
 * Assumptions: a thin sheet (thickness well below s), one straight edge (a wafer's circular
 * edge is straight to first order when d is small against the radius), no other boundary.
 * Source: L. B. Valdes, Proc. IRE 42, 420 (1954) (the image treatment of boundaries);
 * A. Uhlir, Bell Syst. Tech. J. 34, 105 (1955); F. M. Smits, Bell Syst. Tech. J. 37, 711
 * (1958).
 *
 * @param input distanceCm (>= 0, from the edge to the nearest probe for `perpendicular`, to
 *   the probe line for `parallel`), spacingCm (> 0), orientation (default `perpendicular`)
 * @returns the factor (>= 1)
 * @example edgeCorrectionFactor({ distanceCm: 0.1, spacingCm: 0.1 }) // 1.0963
 * @example edgeCorrectionFactor({ distanceCm: 0, spacingCm: 0.1, orientation: 'parallel' }) // 2
 */
export function edgeCorrectionFactor(input: {
  distanceCm: number;
  spacingCm: number;
  orientation?: ProbeOrientation;
}): number {
  const fn = 'edgeCorrectionFactor';
  const o = requireObject(fn, 'input', input);
  const d = requireNonNegative(fn, 'distanceCm', o['distanceCm']);
  const s = requirePositive(fn, 'spacingCm', o['spacingCm']);
  const orientation =
    o['orientation'] === undefined
      ? 'perpendicular'
      : requireOneOf(fn, 'orientation', o['orientation'], PROBE_ORIENTATIONS);
  const delta = d / s;
  if (!Number.isFinite(delta)) {
    throw new PhysicsInputError(fn, 'distanceCm', `requires a finite distanceCm, got ${d}`);
  }
  return edgeVoltage(orientation, delta, true) / edgeVoltage(orientation, delta, false);
}
