import { definePart, requiredNumber } from './types';

export const dcCurrentSourceSpec = definePart({
  type: 'dc_current_source',
  label: 'DC current source',
  description:
    'An ideal DC current source: drives `current` out of its pos pin into the circuit and takes it back at neg, as a battery would.',
  designator: 'I',
  pins: [
    { name: 'pos', label: '+ (current out)' },
    { name: 'neg', label: '− (current in)' },
  ],
  params: {
    current: requiredNumber({
      label: 'Current',
      unit: 'A',
      description: 'Current leaving the pos pin into the circuit.',
    }),
  },
});
