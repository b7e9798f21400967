// Physical constants, exact in the 2019 SI.
export const BOLTZMANN = 1.380649e-23; // J/K
export const ELEMENTARY_CHARGE = 1.602176634e-19; // C
export const ZERO_CELSIUS_K = 273.15;
/** Temperature at which all part parameters are specified (no scaling applied there). */
export const NOMINAL_TEMPERATURE_C = 25;
export const NOMINAL_TEMPERATURE_K = NOMINAL_TEMPERATURE_C + ZERO_CELSIUS_K;

/** V_T = k·T/q for a temperature in kelvin. */
export function thermalVoltage(temperatureK: number): number {
  return (BOLTZMANN * temperatureK) / ELEMENTARY_CHARGE;
}

export function celsiusToKelvin(c: number): number {
  return c + ZERO_CELSIUS_K;
}
