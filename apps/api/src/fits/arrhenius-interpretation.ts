import type { FitInterpretation, RegimeName } from '@rhotrace/api-types';
import { BOLTZMANN_EV_PER_K, fitArrhenius, type ArrheniusFit } from '@rhotrace/physics';
import type { AnalysisPoint } from '../analysis/sweep-data.service';

/**
 * Ratio of the cold-end to the warm-end activation energy of the freeze-out data above which
 * the slope is taken to rise from Ed/2 towards Ed (n falling below N_A). The full change is a
 * factor 2 (Sze 1981; Blakemore 1962, from memory); uncompensated model curves of silicon vary
 * by less than 1.1 between the thirds, so 1.3 separates the two (Rhotrace's choice, no source).
 */
export const COMPENSATION_SLOPE_RATIO = 1.3;

/** How the compensation of a freeze-out reading was settled. */
export interface CompensationReading {
  compensation: FitInterpretation['compensation'];
  source: FitInterpretation['compensationSource'];
  why: string;
}

const eaOf = (points: readonly AnalysisPoint[], options: Parameters<typeof fitArrhenius>[1]) => {
  const r = fitArrhenius(
    points.map((p) => ({ temperatureK: p.temperatureK, value: p.resistivityOhmCm })),
    options,
  );
  return { ea: r.parameters.activationEnergyEv, se: r.standardErrors.activationEnergyEv ?? null };
};

/** Readings at least this many times the sweep's lowest resistivity count as deep freeze-out. */
export const DEEP_FREEZE_OUT_FACTOR = 10;

/**
 * Infers the compensation of a freeze-out window from the data. In an uncompensated sample
 * n ~ sqrt(Nc N_D / 2) exp(-Ed / 2kT), so the slope reads Ed/2; once n falls below N_A it is
 * n ~ Nc (N_D - N_A) / (2 N_A) exp(-Ed / kT), reading Ed (Sze 1981; Blakemore 1962, from memory).
 * Only deep freeze-out readings are compared (colder than the sweep's lowest resistivity and at
 * least `DEEP_FREEZE_OUT_FACTOR` times it, so n is well below N_D - N_A and the approach to
 * exhaustion does not flatten the warm end). Their coldest and warmest thirds are fitted;
 * when the cold third's activation energy exceeds the warm third's by
 * `COMPENSATION_SLOPE_RATIO` and by twice their combined standard error, the change is seen and
 * the window reads as compensated when its own Ea is nearer (on a log scale) the cold value,
 * else uncompensated. With no change seen and a tabulated level for the lot's dopant, the
 * window reads as whichever of E0/2 and E0 its Ea is nearer; otherwise 'unknown'.
 */
export function inferCompensation(
  windowEa: number,
  all: readonly AnalysisPoint[],
  options: { stepToleranceK: number; prefactorExponent: number; tableLevelEv: number | null },
): CompensationReading {
  // Colder than the lowest resistivity (not the intrinsic side) and far above it.
  let lowest = Number.POSITIVE_INFINITY;
  let lowestK = 0;
  for (const p of all) {
    if (p.resistivityOhmCm < lowest) {
      lowest = p.resistivityOhmCm;
      lowestK = p.temperatureK;
    }
  }
  const deep = all.filter(
    (p) => p.temperatureK < lowestK && p.resistivityOhmCm >= DEEP_FREEZE_OUT_FACTOR * lowest,
  );
  const byTable = (why: string): CompensationReading => {
    const level = options.tableLevelEv;
    if (level === null || !(windowEa > 0))
      return { compensation: 'unknown', source: 'inferred', why };
    const compensated =
      Math.abs(Math.log(windowEa / level)) < Math.abs(Math.log((2 * windowEa) / level));
    return {
      compensation: compensated ? 'compensated' : 'uncompensated',
      source: 'inferred',
      why:
        `${why}; Ea is nearer ${compensated ? 'E0' : 'E0/2'} of the tabulated level ` +
        `${level.toFixed(4)} eV`,
    };
  };
  if (deep.length < 12) return byTable('too few deep freeze-out readings to compare slopes');
  const third = Math.floor(deep.length / 3);
  const coldTopK = deep[third - 1]!.temperatureK;
  const warmBottomK = deep[deep.length - third]!.temperatureK;
  const fitOptions = {
    stepToleranceK: options.stepToleranceK,
    prefactorExponent: options.prefactorExponent,
  };
  let c: { ea: number; se: number | null };
  let w: { ea: number; se: number | null };
  try {
    c = eaOf(
      deep.filter((p) => p.temperatureK <= coldTopK),
      fitOptions,
    );
    w = eaOf(
      deep.filter((p) => p.temperatureK >= warmBottomK),
      fitOptions,
    );
  } catch (error) {
    if (error instanceof RangeError) return byTable('too few temperature steps to compare slopes');
    throw error;
  }
  const spread = Math.hypot(c.se ?? Number.POSITIVE_INFINITY, w.se ?? Number.POSITIVE_INFINITY);
  const seen = w.ea > 0 && c.ea >= COMPENSATION_SLOPE_RATIO * w.ea && c.ea - w.ea > 2 * spread;
  if (!seen || !(windowEa > 0)) {
    return byTable(
      `no change of slope in deep freeze-out (coldest third ${c.ea.toFixed(4)} eV, warmest ${w.ea.toFixed(4)} eV)`,
    );
  }
  const compensated = Math.abs(Math.log(windowEa / c.ea)) < Math.abs(Math.log(windowEa / w.ea));
  return {
    compensation: compensated ? 'compensated' : 'uncompensated',
    source: 'inferred',
    why:
      `the slope rises from ${w.ea.toFixed(4)} eV above ${warmBottomK.toFixed(1)} K to ` +
      `${c.ea.toFixed(4)} eV below ${coldTopK.toFixed(1)} K (n falling below N_A), and this window follows the ` +
      `${compensated ? 'cold' : 'warm'} part`,
  };
}

/**
 * The interpretation of an Arrhenius fit as data: intrinsic reads Eg(0 K) = 2 Ea (the gap
 * extrapolated linearly to 0 K, Morin & Maita 1954), freeze-out reads Ed = 2 Ea uncompensated
 * or Ea compensated (Ed/2 assumed when unknown, and said), extrinsic reads nothing.
 */
export function interpretArrhenius(
  fit: ArrheniusFit,
  input: {
    regime: RegimeName | null;
    prefactorExponent: number;
    compensation: CompensationReading | null;
    meanTemperatureK: number;
  },
): FitInterpretation {
  const ea = fit.parameters.activationEnergyEv;
  const se = fit.standardErrors.activationEnergyEv ?? null;
  const m = input.prefactorExponent;
  const shift = BOLTZMANN_EV_PER_K * input.meanTemperatureK;
  // For resistivity the prefactor is the density of states (T^3/4 uncompensated freeze-out,
  // T^3/2 compensated or intrinsic) times the mobility's T^p; Rhotrace does not know p here.
  const assumption =
    `Ea is the slope of ln(value T^${m}) against 1/kT; the true prefactor T^m' (density of ` +
    `states times mobility) shifts Ea by about (m' - ${m}) x ${shift.toFixed(4)} eV, so a ` +
    "full-model fit reads the level with the model's mobility instead.";
  const base = { regime: input.regime, prefactorExponent: m };
  if (input.regime === null || input.regime === 'extrinsic') {
    return {
      ...base,
      property: null,
      valueEv: null,
      standardErrorEv: null,
      compensation: 'unknown',
      compensationSource: 'not-applicable',
      note:
        input.regime === null
          ? 'No regime was given or suggested for this window, so the slope is not read.'
          : 'Extrinsic range: carriers are fully ionized, so the slope reflects mobility and is not an activation energy.',
    };
  }
  const positive = ea > 0;
  if (input.regime === 'intrinsic') {
    return {
      ...base,
      property: 'band-gap-0K',
      valueEv: positive ? 2 * ea : null,
      standardErrorEv: positive && se !== null ? 2 * se : null,
      compensation: 'unknown',
      compensationSource: 'not-applicable',
      note: positive
        ? `Intrinsic range: n_i ~ exp(-Eg/2kT), so Eg(0 K, linear extrapolation) = 2 Ea. ${assumption}`
        : 'The slope is not positive: the window shows no intrinsic activation.',
    };
  }
  const c = input.compensation ?? {
    compensation: 'unknown' as const,
    source: 'inferred' as const,
    why: '',
  };
  const factor = c.compensation === 'compensated' ? 1 : 2;
  const how =
    c.source === 'request'
      ? `the request says the sample is ${c.compensation}`
      : c.compensation === 'unknown'
        ? `compensation unknown (${c.why}), so Ed/2 is assumed; a compensated sample reads Ed = Ea`
        : `compensation inferred: ${c.why}`;
  return {
    ...base,
    property: 'dopant-level',
    valueEv: positive ? factor * ea : null,
    standardErrorEv: positive && se !== null ? factor * se : null,
    compensation: c.compensation,
    compensationSource: c.source,
    note: positive
      ? `Freeze-out range: Ea ≈ ${factor === 1 ? 'Ed' : 'Ed/2'} (${how}). ${assumption}`
      : 'The slope is not positive: the window shows no freeze-out activation.',
  };
}
