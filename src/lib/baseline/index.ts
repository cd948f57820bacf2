/**
 * Weather-normalized baselines: change-point / variable-base degree-day models fitted to bills.
 * Pure computation (no Node, no database): runs in Node, the browser and workers alike.
 */
export * from './grid';
export * from './calendar-days';
export * from './daily-temperatures';
export * from './period-degree-days';
export * from './station-degree-days';
export * from './bill-periods';
export * from './least-squares';
export * from './householder-qr';
export * from './student-t';
export * from './search-workspace';
export * from './candidate-search';
export * from './two-slope-search';
export * from './fit-statistics';
export * from './model';
export * from './selection';
export * from './acceptance';
export * from './engine';
export * from './fit-baseline';
export * from './normal-year';
export * from './nac';
export * from './savings-uncertainty';
export * from './reporting-savings';
export * from './series-summary';
export * from './prepare';
