export * from './errors';
export * from './common';
export * from './auth';
export * from './records';
export * from './analysis';
export { FIT_EXCLUDED_FLAGS, FIT_KINDS } from './fits';
export type {
  FitCorrelation,
  FitCurvature,
  FitDto,
  FitGoodness,
  FitInterpretation,
  FitKind,
  FitRequest,
  FitRequestOptions,
} from './fits';
export * from './spec';
export * from './sweeps';
export * from './activity';
