/** Weather: day numbers, daily temperatures, gap filling, coverage and degree days. */
export * from './day-number';
export * from './temperature';
export * from './daily-series';
export * from './gap-fill';
export * from './coverage';
export * from './degree-day-table';
export * from './period-degree-days';
export * from './normal-year';
