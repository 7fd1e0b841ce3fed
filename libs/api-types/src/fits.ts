/**
 * Fit API shapes: the request by kind and the stored fit. Units are in the field names.
 */
import type { DopingInput, RegimeName } from './analysis';
import type { PointFlag } from './sweeps';

export const FIT_KINDS = [
  'arrhenius',
  'model',
  'tcr',
  'bloch-gruneisen',
  'carrier-density',
  'hall-mobility',
] as const;
export type FitKind = (typeof FIT_KINDS)[number];

/**
 * Point flags that leave a reading out of fits unless the request says `includeFlagged: true`:
 * the suspicious ones (a resistivity jump, a temperature against the ramp, a Hampel outlier, a
 * reading warmed by its current, a step not settled, a contact fault). `polarity-averaged` and
 * `unpaired-polarity` say how a point was formed, not that it is doubtful. A
 * `polarity-asymmetry` point stays in: the forward/reverse mean cancels an additive
 * thermoelectric offset, the usual cause, so the flag asks for a look rather than removal.
 */
export const FIT_EXCLUDED_FLAGS: readonly PointFlag[] = [
  'jump',
  'temperature-reversal',
  'outlier',
  'self-heating',
  'unsettled',
  'contact-fault',
];

/** Options every fit request takes. */
export interface FitRequestOptions {
  /** Include readings carrying a `FIT_EXCLUDED_FLAGS` flag. Default false. */
  includeFlagged?: boolean;
  /** The ramp leg to fit, or `all`; default: the first leg with at least 5 dwell steps. */
  leg?: number | 'all';
  /** Consecutive readings within this of a step's first reading form one dwell step, K. Default 0.5. */
  stepToleranceK?: number;
  /** Standard uncertainty of each step's temperature, K (effective variance). Default 0. */
  temperatureUncertaintyK?: number;
  /**
   * On a map sweep, the site to fit (its label, or `x,y` in mm when it has none); without it a
   * map is fitted on its map mean (the mean over the sites not excluded, per temperature step).
   */
  site?: string;
}

/** `POST /api/sweeps/:id/fits` body, by kind. */
export type FitRequest = FitRequestOptions &
  (
    | {
        kind: 'arrhenius';
        minK: number;
        maxK: number;
        quantity?: 'resistivity' | 'conductivity';
        prefactorExponent?: number;
        /** Regime for the reading; default: the suggested window the fit window overlaps most. */
        regime?: RegimeName;
        /**
         * Freeze-out only: a compensated sample reads Ea ≈ Ed instead of Ed/2. When absent, the
         * compensation is inferred from the data (`FitInterpretation.compensationSource`).
         */
        compensated?: boolean;
      }
    | {
        kind: 'model';
        material?: string;
        initial: DopingInput & { mobilityScale?: number };
        free: Array<
          'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel' | 'mobilityScale'
        >;
        minK?: number;
        maxK?: number;
      }
    | { kind: 'tcr'; referenceK?: number; minK?: number; maxK?: number }
    | { kind: 'bloch-gruneisen'; minK?: number; maxK?: number }
    | {
        /** Hall sweeps: charge neutrality fitted to the measured n(T) (or p(T)). */
        kind: 'carrier-density';
        material?: string;
        initial: DopingInput;
        free: Array<'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel'>;
        minK?: number;
        maxK?: number;
      }
    | { kind: 'hall-mobility'; minK?: number; maxK?: number }
  );

/** Correlation matrix of the fitted parameters (rows and columns in `parameters` order). */
export interface FitCorrelation {
  parameters: string[];
  matrix: number[][];
}

/** Goodness of fit; every kind has rSquared (null where not defined), count and residualRms. */
export interface FitGoodness {
  rSquared: number | null;
  /** Readings fitted (see `FitDto.stepCount` for the dwell steps). */
  count: number;
  /** RMS of the residuals, in the residuals' own unit (see `residualUnit`). */
  residualRms: number;
  /** 'ln': every residual is ln(observed / model) of the fitted quantity. */
  residualUnit: string;
  degreesOfFreedom?: number;
  iterations?: number;
  tCritical?: number;
  correlation?: FitCorrelation | null;
  [extra: string]: unknown;
}

/** What an Arrhenius activation energy says about the sample, as data. */
export interface FitInterpretation {
  /** Regime the reading assumes. */
  regime: RegimeName | null;
  property: 'band-gap-0K' | 'dopant-level' | null;
  /** The property's value, eV. */
  valueEv: number | null;
  standardErrorEv: number | null;
  compensation: 'compensated' | 'uncompensated' | 'unknown';
  compensationSource: 'request' | 'inferred' | 'not-applicable';
  /** The T^m prefactor exponent the reading assumes. */
  prefactorExponent: number;
  /** One sentence: method and assumption. */
  note: string;
  /**
   * `carrier-density` fits: the compensation ratio N_minority / N_majority (N_A / N_D for an
   * n-type sample) with its 95 % interval, null when the fit did not free both densities.
   */
  compensationRatio?: { value: number; confidenceInterval95: [number, number] | null } | null;
  /** `hall-mobility` fits: the scattering mechanism the exponent suggests. */
  scattering?: HallScattering | null;
}

/** Scattering mechanisms a Hall-mobility exponent can point to. */
export type HallScattering =
  'acoustic-phonon' | 'acoustic-and-optical-phonon' | 'ionized-impurity' | 'mixed';

/** Quadratic term of ln(value) against 1/(kT) over the window (Arrhenius only), eV^2. */
export interface FitCurvature {
  value: number;
  standardError: number;
  t: number;
  /** |t| > 3: the window bends, usually because it spans two regimes. */
  significant: boolean;
}

/** A stored fit. */
export interface FitDto {
  id: number;
  sweepId: number;
  kind: FitKind;
  /** Everything needed to re-run the fit (the request plus defaults applied). */
  inputs: Record<string, unknown>;
  windowMinK: number | null;
  windowMaxK: number | null;
  parameters: Record<string, number>;
  standardErrors: Record<string, number | null>;
  /** 95 % intervals keyed like `standardErrors`; none when the fit has not converged. */
  confidenceIntervals: Record<string, [number, number] | null>;
  goodness: FitGoodness;
  /** ln(observed / model) per reading fitted. */
  residuals: Array<{ temperatureK: number; residual: number }>;
  converged: boolean;
  reason: string | null;
  reading: string | null;
  /** Dwell steps fitted (`goodness.count` stays the number of readings); null on older fits. */
  stepCount: number | null;
  /** Sequence numbers of flagged readings in the window left out of the fit. */
  excludedSequences: number[];
  interpretation: FitInterpretation | null;
  /** Arrhenius only. */
  curvature: FitCurvature | null;
  /** e.g. the window spans two regimes, a parameter at a bound, a relative standard error > 50 %. */
  warnings: string[];
  modelVersion: string;
  createdBy: { id: number; name: string | null };
  createdAt: string;
}

/** `POST /api/sweeps/:id/fits/preview` answer: the fit as it would be saved, not stored. */
export type FitPreviewDto = Omit<FitDto, 'id' | 'createdAt' | 'createdBy'>;
