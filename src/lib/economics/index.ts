/** Measure economics: present-value factors, the bounded real discount rate, payback, SIR, AIRR. */
export * from './present-value';
export * from './discount-rate';
export * from './measure-economics';
