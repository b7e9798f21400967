import { defaultNumber, definePart, enumParam, requiredNumber, temperatureParam } from './types';

export const POT_TAPERS = ['linear', 'log'] as const;

export const potentiometerSpec = definePart({
  type: 'potentiometer',
  label: 'Potentiometer',
  description:
    'A three-terminal variable resistor. position 0 puts the wiper at a, 1 at b. "log" is an audio (type A) taper: 10 % of the track resistance between a and w at mid-rotation.',
  designator: 'RV',
  pins: [
    { name: 'a', label: 'A (CCW end)' },
    { name: 'w', label: 'Wiper' },
    { name: 'b', label: 'B (CW end)' },
  ],
  params: {
    resistance: requiredNumber({
      label: 'Resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      tolerance: { kind: 'fraction', param: 'tolerance' },
      description: 'End-to-end track resistance (a to b).',
    }),
    position: defaultNumber(0.5, {
      label: 'Position',
      unit: '',
      rule: { kind: 'range', min: 0, max: 1 },
      description: 'Wiper position, 0..1 from a to b.',
    }),
    taper: enumParam(POT_TAPERS, 'linear', {
      label: 'Taper',
      description: 'linear: R(a–w) = position × resistance; log: R(a–w) = resistance × (81^position − 1)/80.',
    }),
    tolerance: defaultNumber(0.2, {
      label: 'Tolerance',
      unit: '',
      rule: { kind: 'range', min: 0, max: 1 },
      sweepable: false,
      toleranceOf: 'resistance',
      description: 'Track resistance tolerance as a fraction.',
    }),
    powerRating: defaultNumber(0.5, {
      label: 'Power rating',
      unit: 'W',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Rating of the whole track; a section may dissipate its share of the track.',
    }),
    tempco: defaultNumber(0, {
      label: 'Temperature coefficient',
      unit: 'ppm/K',
      sweepable: false,
      description: 'Track resistance temperature coefficient.',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  },
});
