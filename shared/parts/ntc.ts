import { z } from 'zod';
import { defaultNumber, definePart, temperatureParam, type ParamDef } from './types';

const steinhartHart: ParamDef<z.ZodOptional<z.ZodObject<{ a: z.ZodNumber; b: z.ZodNumber; c: z.ZodNumber }>>> = {
  info: {
    label: 'Steinhart–Hart coefficients',
    kind: 'coefficients',
    unit: '',
    required: false,
    sweepable: false,
    description: '1/T = a + b·ln R + c·(ln R)³ (T in kelvin, R in ohms). When present it is used instead of beta.',
    advanced: true,
  },
  schema: z.object({ a: z.number(), b: z.number(), c: z.number() }).optional(),
};

export const ntcSpec = definePart({
  type: 'ntc',
  label: 'NTC thermistor',
  description: 'A negative-temperature-coefficient thermistor (B-parameter or Steinhart–Hart).',
  designator: 'TH',
  pins: [
    { name: 'a', label: 'A' },
    { name: 'b', label: 'B' },
  ],
  params: {
    nominalResistance: defaultNumber(10000, {
      label: 'Nominal resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      tolerance: { kind: 'fraction', param: 'tolerance' },
      description: 'Resistance at nominalTemperatureC.',
    }),
    nominalTemperatureC: defaultNumber(25, {
      label: 'Nominal temperature',
      unit: '°C',
      rule: { kind: 'above', min: -273.15 },
      sweepable: false,
      description: 'Temperature at which nominalResistance is specified.',
    }),
    beta: defaultNumber(3950, {
      label: 'B constant',
      unit: 'K',
      rule: { kind: 'positive' },
      description: 'R(T) = R₀·exp(B·(1/T − 1/T₀)).',
    }),
    tolerance: defaultNumber(0.01, {
      label: 'Tolerance',
      unit: '',
      rule: { kind: 'range', min: 0, max: 1 },
      sweepable: false,
      toleranceOf: 'nominalResistance',
      description: 'Tolerance of the nominal resistance as a fraction.',
    }),
    steinhartHart,
    temperatureC: temperatureParam(),
  },
  crossCheck: (p) => {
    const sh = p.steinhartHart as { a: number; b: number; c: number } | undefined;
    if (sh && sh.b === 0 && sh.c === 0) return [['steinhartHart', 'needs a non-zero b or c coefficient']];
    if (sh && (sh.b < 0 || sh.c < 0)) return [['steinhartHart', 'b and c must not be negative for an NTC']];
    return [];
  },
});
