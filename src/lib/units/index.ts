/** Units: billed quantities to site kBtu or gallons, unit parsing, source energy and emissions. */
export * from './factors';
export * from './commodity-units';
export * from './parse-unit';
export * from './convert';
export * from './site-energy';
export * from './source-energy';
export * from './emissions';
