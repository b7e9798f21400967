// The circuit engine: DC operating point by modified nodal analysis.
export { compileCircuit, solveOperatingPoint } from './compile';
export type { CompiledCircuit, CircuitSolveOptions, ParamOverrides, RawSolveResult, SolveOptions } from './compile';
export * from './result';
export * from './constants';
export type { Device, DeviceModel, DeviceEnv, TopologyEdge, Stamper } from './device';
export type { LinearSolverKind, LinearSystem, LinearSystemFactory } from './linear/types';
export type { ParamRef, SensitivityEntry, SensitivityOutput, SensitivityReport } from './sensitivity';
