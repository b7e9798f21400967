// Constants for the reference evaluators (exact in the 2019 SI; shared/references.md).
export const K_B = 1.380649e-23;
export const Q_E = 1.602176634e-19;
export const vt = (tK: number) => (K_B * tK) / Q_E;
export const T25 = 298.15;
