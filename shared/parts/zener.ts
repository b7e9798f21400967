import { defaultNumber, definePart, requiredNumber, temperatureParam } from './types';

export const zenerSpec = definePart({
  type: 'zener',
  label: 'Zener diode',
  description:
    'A diode whose reverse breakdown passes testCurrent at zenerVoltage with dynamic resistance zenerResistance there; forward it behaves as a diode.',
  designator: 'DZ',
  pins: [
    { name: 'anode', label: 'Anode' },
    { name: 'cathode', label: 'Cathode' },
  ],
  params: {
    zenerVoltage: requiredNumber({
      label: 'Zener voltage',
      unit: 'V',
      rule: { kind: 'positive' },
      description: 'Reverse voltage (cathode above anode) at testCurrent.',
    }),
    testCurrent: defaultNumber(0.005, {
      label: 'Test current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Reverse current at which zenerVoltage and zenerResistance are specified.',
    }),
    zenerResistance: defaultNumber(10, {
      label: 'Zener resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      description: 'Dynamic resistance at testCurrent.',
    }),
    powerRating: defaultNumber(0.5, {
      label: 'Power rating',
      unit: 'W',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Rated dissipation; the solver warns above it and cautions above 50 % of it.',
    }),
    zenerTempco: defaultNumber(0, {
      label: 'Zener voltage temperature coefficient',
      unit: 'V/K',
      sweepable: false,
      description: 'V_Z(T) = zenerVoltage + zenerTempco·(T − 25 °C).',
      advanced: true,
    }),
    saturationCurrent: defaultNumber(1e-14, {
      label: 'Saturation current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Forward I_S at 25 °C.',
      advanced: true,
    }),
    emissionCoefficient: defaultNumber(1, {
      label: 'Emission coefficient',
      unit: '',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Forward ideality factor n.',
      advanced: true,
    }),
    seriesResistance: defaultNumber(0, {
      label: 'Series resistance',
      unit: 'Ω',
      rule: { kind: 'nonNegative' },
      sweepable: false,
      description: 'Ohmic resistance in series with the junction.',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  },
});
