/** Kits and their power budget: pure mapping from a kit to lib/measure `powerBudget`, totals, CSV, schemas. */
export * from './types';
export * from './sky';
export * from './schemas';
export * from './resolve';
export * from './budget';
export * from './totals';
export * from './csv';
export * from './paths';
