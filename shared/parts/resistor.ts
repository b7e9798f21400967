import { defaultNumber, definePart, requiredNumber, temperatureParam } from './types';

export const resistorSpec = definePart({
  type: 'resistor',
  label: 'Resistor',
  description: 'A fixed resistor with a tolerance, a power rating and a linear temperature coefficient.',
  designator: 'R',
  pins: [
    { name: 'a', label: 'A' },
    { name: 'b', label: 'B' },
  ],
  params: {
    resistance: requiredNumber({
      label: 'Resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      tolerance: { kind: 'fraction', param: 'tolerance' },
      description: 'Resistance at 25 °C.',
    }),
    tolerance: defaultNumber(0.01, {
      label: 'Tolerance',
      unit: '',
      rule: { kind: 'range', min: 0, max: 1 },
      sweepable: false,
      toleranceOf: 'resistance',
      description: 'Manufacturing tolerance as a fraction (0.01 = ±1 %).',
    }),
    powerRating: defaultNumber(0.25, {
      label: 'Power rating',
      unit: 'W',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Rated dissipation; the solver warns above it and cautions above 50 % of it.',
    }),
    tempco: defaultNumber(0, {
      label: 'Temperature coefficient',
      unit: 'ppm/K',
      sweepable: false,
      description: 'R(T) = R·(1 + tempco·1e-6·(T − 25 °C)).',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  },
});
