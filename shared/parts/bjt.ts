import { defaultNumber, temperatureParam } from './types';

/** Params shared by the NPN and PNP specs (npn.ts, pnp.ts). */
export function bjtParams() {
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
      description: 'E_g for the temperature scaling of I_S.',
      advanced: true,
    }),
    saturationCurrentTempExp: defaultNumber(3, {
      label: 'I_S temperature exponent',
      unit: '',
      sweepable: false,
      description: 'XTI for the temperature scaling of I_S.',
      advanced: true,
    }),
    temperatureC: temperatureParam(),
  };
}

export const bjtPins = [
  { name: 'c', label: 'Collector' },
  { name: 'b', label: 'Base' },
  { name: 'e', label: 'Emitter' },
] as const;
