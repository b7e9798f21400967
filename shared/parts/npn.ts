import { bjtParams, bjtPins } from './bjt';
import { definePart } from './types';

export const npnSpec = definePart({
  type: 'npn',
  label: 'NPN transistor',
  description: 'An NPN bipolar transistor, Ebers–Moll transport model.',
  designator: 'Q',
  pins: bjtPins,
  params: bjtParams(),
});
