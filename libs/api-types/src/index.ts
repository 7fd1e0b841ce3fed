export * from './errors';
export * from './common';
export * from './auth';
export * from './records';
export * from './analysis';
export * from './spec';
export * from './sweeps';
export * from './activity';
