export * from './auth';
export * from './inventory';
export * from './intake';
export * from './analysis';
export * from './field';
export * from './system';
