import { defaultBoolean, defaultNumber, definePart } from './types';

export const switchSpec = definePart({
  type: 'switch',
  label: 'Switch',
  description: 'A single-pole switch: onResistance when closed, offResistance when open.',
  designator: 'S',
  pins: [
    { name: 'a', label: 'A' },
    { name: 'b', label: 'B' },
  ],
  params: {
    closed: defaultBoolean(true, { label: 'Closed', description: 'true when the switch conducts.' }),
    onResistance: defaultNumber(0.01, {
      label: 'On resistance',
      unit: 'Ω',
      rule: { kind: 'nonNegative' },
      sweepable: false,
      description: 'Resistance when closed (0 = ideal).',
    }),
    offResistance: defaultNumber(1e9, {
      label: 'Off resistance',
      unit: 'Ω',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Resistance when open.',
    }),
  },
});
