import { definePart } from './types';

export const groundSpec = definePart({
  type: 'ground',
  label: 'Ground',
  description: 'The reference node. Every ground pin is the net named "0".',
  designator: 'GND',
  pins: [{ name: 'g', label: 'Ground' }],
  params: {},
});
