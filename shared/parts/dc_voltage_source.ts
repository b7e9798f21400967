import { defaultNumber, definePart, optionalNumber, requiredNumber } from './types';

export const dcVoltageSourceSpec = definePart({
  type: 'dc_voltage_source',
  label: 'DC voltage source',
  description: 'An ideal DC voltage source (pos is +) with an optional internal series resistance.',
  designator: 'V',
  pins: [
    { name: 'pos', label: '+' },
    { name: 'neg', label: '−' },
  ],
  params: {
    voltage: requiredNumber({
      label: 'Voltage',
      unit: 'V',
      tolerance: { kind: 'range', minParam: 'min', maxParam: 'max' },
      description: 'Open-circuit voltage of pos against neg.',
    }),
    internalResistance: defaultNumber(0, {
      label: 'Internal resistance',
      unit: 'Ω',
      rule: { kind: 'nonNegative' },
      description: 'Series resistance (0 = ideal).',
    }),
    min: optionalNumber({
      label: 'Minimum voltage',
      unit: 'V',
      description: 'Lowest supply voltage, for sweeps and worst-case runs.',
    }),
    max: optionalNumber({
      label: 'Maximum voltage',
      unit: 'V',
      description: 'Highest supply voltage, for sweeps and worst-case runs.',
    }),
  },
  crossCheck: (p) => {
    const out: Array<[string, string]> = [];
    if (typeof p.min === 'number' && typeof p.max === 'number' && p.min > p.max)
      out.push(['min', `must not be above "max" (got min ${p.min}, max ${p.max})`]);
    return out;
  },
});
