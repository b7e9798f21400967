import { defaultNumber, definePart, temperatureParam } from './types';

export const ledSpec = definePart({
  type: 'led',
  label: 'LED',
  description: 'A light-emitting diode described by its forward voltage at a test current.',
  designator: 'D',
  pins: [
    { name: 'anode', label: 'Anode' },
    { name: 'cathode', label: 'Cathode' },
  ],
  params: {
    forwardVoltage: defaultNumber(2.0, {
      label: 'Forward voltage',
      unit: 'V',
      rule: { kind: 'positive' },
      description: 'Forward voltage at testCurrent, 25 °C.',
    }),
    testCurrent: defaultNumber(0.02, {
      label: 'Test current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Current at which forwardVoltage is specified.',
    }),
    emissionCoefficient: defaultNumber(2, {
      label: 'Emission coefficient',
      unit: '',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Ideality factor n.',
    }),
    maxCurrent: defaultNumber(0.03, {
      label: 'Maximum current',
      unit: 'A',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Absolute maximum forward current; the solver warns above it.',
    }),
    seriesResistance: defaultNumber(0, {
      label: 'Series resistance',
      unit: 'Ω',
      rule: { kind: 'nonNegative' },
      sweepable: false,
      description: 'Ohmic resistance in series with the junction.',
      advanced: true,
    }),
    maxReverseVoltage: defaultNumber(5, {
      label: 'Maximum reverse voltage',
      unit: 'V',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Reverse voltage above which the solver warns.',
      advanced: true,
    }),
    forwardVoltageTempco: defaultNumber(-0.002, {
      label: 'Forward voltage temperature coefficient',
      unit: 'V/K',
      sweepable: false,
      description: 'Change of the forward voltage at testCurrent per kelvin.',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  },
});
