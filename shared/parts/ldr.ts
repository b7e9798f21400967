import { defaultNumber, definePart, optionalNumber } from './types';

export const ldrSpec = definePart({
  type: 'ldr',
  label: 'Light-dependent resistor',
  description: 'A photoresistor: R = resistanceAt10Lux × (E / 10 lux)^(−gamma), capped at darkResistance.',
  designator: 'LDR',
  pins: [
    { name: 'a', label: 'A' },
    { name: 'b', label: 'B' },
  ],
  params: {
    resistanceAt10Lux: defaultNumber(10000, {
      label: 'Resistance at 10 lx',
      unit: 'Ω',
      rule: { kind: 'positive' },
      description: 'Resistance at an illuminance of 10 lux.',
    }),
    gamma: defaultNumber(0.7, {
      label: 'Gamma',
      unit: '',
      rule: { kind: 'positive' },
      description: 'log₁₀(R₁₀/R₁₀₀): the log–log slope between 10 lx and 100 lx.',
    }),
    darkResistance: defaultNumber(1e6, {
      label: 'Dark resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Upper limit of the resistance (in darkness).',
    }),
    illuminanceLux: optionalNumber({
      label: 'Illuminance',
      unit: 'lx',
      rule: { kind: 'nonNegative' },
      sweepable: true,
      description: "This part's own illuminance; overrides the sheet's conditions.illuminanceLux.",
      advanced: true,
    }),
  },
});
