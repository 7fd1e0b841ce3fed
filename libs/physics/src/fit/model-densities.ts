/**
 * The coordinates `fitModel` fits the dopant densities in, so the conduction type stays put.
 */
import type { ModelParameter } from './model-fit';

type DensityName = 'donorDensity' | 'acceptorDensity';

/** @internal How `fitModel` maps its free densities to solver coordinates and back. */
export interface DensityCoordinates {
  /** Free densities in reported order (donor first). */
  names: DensityName[];
  /** Solver coordinates they take (the first `size` of the vector). */
  size: number;
  initial: number[];
  unpack: (q: readonly number[]) => Partial<Record<DensityName, number>>;
  /** Solver coordinates and covariance to reported ones (ln densities first, rest unchanged). */
  reported: (
    q: readonly number[],
    covariance: number[][] | null,
  ) => { coordinates: number[]; covariance: number[][] | null };
}

const logistic = (v: number): number => 1 / (1 + Math.exp(-v));

/**
 * @internal With both densities free: q0 = ln N_net, q1 = logit r, r = N_min / N_maj, so
 * N_maj = N_net / (1 - r), N_min = r N_net / (1 - r); d ln N_maj = dq0 + r dq1 and
 * d ln N_min = dq0 + dq1 (delta method for the reported covariance). With one free: its
 * logarithm. The majority is the donor for an n-type start.
 */
export function densityCoordinates(
  fn: string,
  free: readonly ModelParameter[],
  values: Record<ModelParameter, number>,
  nType: boolean,
): DensityCoordinates {
  const names = (['donorDensity', 'acceptorDensity'] as const).filter((n) => free.includes(n));
  const majority: DensityName = nType ? 'donorDensity' : 'acceptorDensity';
  const minority: DensityName = nType ? 'acceptorDensity' : 'donorDensity';
  const identity = (q: readonly number[], covariance: number[][] | null) => ({
    coordinates: [...q],
    covariance,
  });
  if (names.length < 2) {
    return {
      names,
      size: names.length,
      initial: names.map((n) => Math.log(values[n])),
      unpack: (q) => (names.length ? { [names[0]!]: Math.exp(q[0]!) } : {}),
      reported: identity,
    };
  }
  const nMaj = values[majority];
  const nMin = values[minority];
  if (!(nMin < nMaj)) {
    throw new RangeError(
      `\`${fn}\` requires different starting donorDensity and acceptorDensity when both are ` +
        `free (the larger one sets the conduction type the fit keeps), got ${nMaj} and ${nMin}`,
    );
  }
  const split = (q: readonly number[]) => {
    const r = logistic(q[1]!);
    const maj = Math.exp(q[0]!) / (1 - r);
    return { r, maj, min: r * maj };
  };
  return {
    names,
    size: 2,
    initial: [Math.log(nMaj - nMin), Math.log(nMin / nMaj / (1 - nMin / nMaj))],
    unpack: (q) => {
      const { maj, min } = split(q);
      return { [majority]: maj, [minority]: min };
    },
    reported: (q, covariance) => {
      const { maj, min, r } = split(q);
      const lnD = Math.log(nType ? maj : min);
      const lnA = Math.log(nType ? min : maj);
      const coordinates = [lnD, lnA, ...q.slice(2)];
      if (!covariance) return { coordinates, covariance: null };
      // Rows of J: d(ln N_D, ln N_A, rest) / d(q0, q1, rest).
      const k = q.length;
      const j = Array.from({ length: k }, (_, i) => {
        const row = new Array<number>(k).fill(0);
        if (i >= 2) row[i] = 1;
        return row;
      });
      const majRow = nType ? 0 : 1;
      j[majRow]![0] = 1;
      j[majRow]![1] = r;
      j[1 - majRow]![0] = 1;
      j[1 - majRow]![1] = 1;
      const jc = j.map((row) =>
        covariance[0]!.map((_, c) => row.reduce((s, v, m) => s + v * covariance[m]![c]!, 0)),
      );
      const out = jc.map((row) => j.map((other) => row.reduce((s, v, m) => s + v * other[m]!, 0)));
      return { coordinates, covariance: out };
    },
  };
}
