import { bjtParams, bjtPins } from './bjt';
import { definePart } from './types';

export const pnpSpec = definePart({
  type: 'pnp',
  label: 'PNP transistor',
  description: 'A PNP bipolar transistor, Ebers–Moll transport model.',
  designator: 'Q',
  pins: bjtPins,
  params: bjtParams(),
});
