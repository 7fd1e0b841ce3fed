import type { FitKind, FitRequest } from '@rhotrace/api-types';
import { z } from 'zod';
import type { AnalysisPoint } from '../analysis/sweep-data.service';
import type { FitComputation } from './fit-computation';
import { arrheniusKind } from './kinds/arrhenius.kind';
import { blochGruneisenKind } from './kinds/bloch-gruneisen.kind';
import { carrierDensityKind } from './kinds/carrier-density.kind';
import { hallMobilityKind } from './kinds/hall-mobility.kind';
import { modelKind } from './kinds/model.kind';
import { tcrKind } from './kinds/tcr.kind';

/** The request of one fit kind. */
export type FitRequestOf<K extends FitKind> = {
  [P in FitKind]: Extract<FitRequest, { kind: P }>;
}[K];

/** What a fit kind is given: the readings and what is known of the sample. */
export interface FitContext {
  /** Readings in the window (flagged ones left out unless included), sorted by temperature. */
  points: AnalysisPoint[];
  /** Every reading the fit may use, whole sweep (for suggested windows and inferences). */
  all: AnalysisPoint[];
  /** The lot's material and dopant. */
  material: string;
  dopant: string | null;
  stepToleranceK: number;
  temperatureUncertaintyK: number;
}

/** What a fit kind answers. */
export interface FitRun {
  computation: FitComputation;
  /** The kind's own inputs, defaults applied (the service adds the window and step options). */
  inputs: Record<string, unknown>;
  /** Names the parameter set in the model version. */
  parameterSet: string;
}

/** One row of the fit table: how a kind's request is checked and how it runs and reads. */
export interface FitKindEntry<K extends FitKind> {
  /** The request body of this kind, checked field by field (unknown fields refused). */
  schema: z.ZodType<FitRequestOf<K>, z.ZodTypeDef, unknown>;
  run: (request: FitRequestOf<K>, context: FitContext) => FitRun;
}

/** Every fit kind, keyed by kind: a new kind is one new entry and one file in `kinds/`. */
export const FIT_KIND_TABLE: { [K in FitKind]: FitKindEntry<K> } = {
  arrhenius: arrheniusKind,
  model: modelKind,
  tcr: tcrKind,
  'bloch-gruneisen': blochGruneisenKind,
  'carrier-density': carrierDensityKind,
  'hall-mobility': hallMobilityKind,
};

/** Runs the kind's entry for a request of that kind. */
export function runFitKind<K extends FitKind>(
  kind: K,
  request: FitRequestOf<K>,
  context: FitContext,
): FitRun {
  const entry: FitKindEntry<K> = FIT_KIND_TABLE[kind];
  return entry.run(request, context);
}
