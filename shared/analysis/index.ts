// Design analyses on top of the engine: sweeps, worst case, Monte Carlo, budgets, Thevenin.
export * from './budgets';
export * from './control';
export * from './evaluate';
export * from './jobs';
export * from './monte-carlo';
export * from './outputs';
export * from './prng';
export * from './sensitivity';
export * from './statistics';
export * from './steps';
export * from './sweep';
export * from './targets';
export * from './thevenin';
export * from './tolerance-space';
export * from './worst-case';
export * from './worst-case-first-order';
export * from './corner-search';
