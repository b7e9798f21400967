import { defaultNumber, definePart, temperatureParam } from './types';

function bjtParams() {
  return {
    beta: defaultNumber(100, {
      label: 'Forward beta',
      unit: '',
      rule: { kind: 'positive' },
      description: 'Forward current gain β_F.',
    }),
    reverseBeta: defaultNumber(1, {
      label: 'Reverse beta',
      unit: '',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Reverse current gain β_R.',
    }),
    saturationCurrent: defaultNumber(1e-14, {
      label: 'Saturation current',
      unit: 'A',
      rule: { kind: 'positive' },
      description: 'Transport saturation current I_S at 25 °C.',
    }),
    bandgap: defaultNumber(1.11, {
      label: 'Band gap',
      unit: 'eV',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'E_g for the temperature scaling of I_S (SPICE EG).',
      advanced: true,
    }),
    saturationCurrentTempExp: defaultNumber(3, {
      label: 'I_S temperature exponent',
      unit: '',
      sweepable: false,
      description: 'XTI for the temperature scaling of I_S (SPICE XTI).',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  };
}

const bjtPins = [
  { name: 'c', label: 'Collector' },
  { name: 'b', label: 'Base' },
  { name: 'e', label: 'Emitter' },
] as const;

export const npnSpec = definePart({
  type: 'npn',
  label: 'NPN transistor',
  description: 'An NPN bipolar transistor, Ebers–Moll transport model.',
  designator: 'Q',
  pins: bjtPins,
  params: bjtParams(),
});

export const pnpSpec = definePart({
  type: 'pnp',
  label: 'PNP transistor',
  description: 'A PNP bipolar transistor, Ebers–Moll transport model.',
  designator: 'Q',
  pins: bjtPins,
  params: bjtParams(),
});
