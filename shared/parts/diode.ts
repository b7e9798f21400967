import { defaultNumber, definePart, optionalNumber, temperatureParam } from './types';

export const diodeSpec = definePart({
  type: 'diode',
  label: 'Diode',
  description: 'A Shockley junction diode with series resistance and optional reverse breakdown.',
  designator: 'D',
  pins: [
    { name: 'anode', label: 'Anode' },
    { name: 'cathode', label: 'Cathode' },
  ],
  params: {
    saturationCurrent: defaultNumber(1e-14, {
      label: 'Saturation current',
      unit: 'A',
      rule: { kind: 'positive' },
      description: 'I_S at 25 °C.',
    }),
    emissionCoefficient: defaultNumber(1, {
      label: 'Emission coefficient',
      unit: '',
      rule: { kind: 'positive' },
      description: 'Ideality factor n.',
    }),
    seriesResistance: defaultNumber(0, {
      label: 'Series resistance',
      unit: 'Ω',
      rule: { kind: 'nonNegative' },
      description: 'Ohmic resistance in series with the junction.',
    }),
    breakdownVoltage: optionalNumber({
      label: 'Breakdown voltage',
      unit: 'V',
      rule: { kind: 'positive' },
      description: 'Reverse voltage at which breakdownCurrent flows; absent means no breakdown.',
    }),
    breakdownCurrent: defaultNumber(1e-3, {
      label: 'Breakdown current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Reverse current at breakdownVoltage.',
      advanced: true,
    }),
    maxCurrent: defaultNumber(1, {
      label: 'Maximum current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Forward (or breakdown) current above which the solver warns.',
    }),
    bandgap: defaultNumber(1.11, {
      label: 'Band gap',
      unit: 'eV',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'E_g for the temperature scaling of I_S (E_g).',
      advanced: true,
    }),
    saturationCurrentTempExp: defaultNumber(3, {
      label: 'I_S temperature exponent',
      unit: '',
      sweepable: false,
      description: 'XTI for the temperature scaling of I_S (XTI).',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  },
});
