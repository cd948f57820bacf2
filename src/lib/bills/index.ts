/** Bills: periods, use per day, calendarization, window totals and data checks. */
export * from './bill';
export * from './effective-periods';
export * from './compensated-sum';
export * from './calendarize';
export * from './window-sum';
export * from './quantile';
export * from './flags';
export * from './row-checks';
export * from './series-checks';
