import { definePart, requiredString } from './types';

export const netLabelSpec = definePart({
  type: 'net_label',
  label: 'Net label',
  description: 'Names its net; labels with the same name are one net. A label named "0" is ground.',
  designator: 'LBL',
  pins: [{ name: 'n', label: 'Net' }],
  params: {
    name: requiredString({ label: 'Name', description: 'The net name.' }),
  },
});
