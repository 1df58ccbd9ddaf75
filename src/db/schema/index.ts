export * from './users';
export * from './vessels';
export * from './tests';
export * from './logs';
export * from './reductions';
export * from './review';
export * from './audit';
export * from './live';
