// Sparse direct solver for circuit matrices: CSC storage, approximate minimum degree ordering,
// left-looking LU with threshold partial pivoting, numeric-only refactorisation, transposed solves.
export * from './csc';
export * from './amd';
export * from './lu-factor';
export * from './lu-refactor';
export * from './lu-symbolic';
export * from './sparse-pattern';
export * from './sparse-solver';
export * from './mna-system';
export * from './defer-zero-diagonals';
