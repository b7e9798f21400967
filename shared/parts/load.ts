import { defaultNumber, definePart, enumParam, requiredNumber } from './types';

export const LOAD_MODES = ['resistance', 'current', 'power'] as const;

export const loadSpec = definePart({
  type: 'load',
  label: 'Load',
  description:
    'A load drawing current from pos to neg: a constant resistance (Ω), a constant current (A) or a constant power (W).',
  designator: 'RL',
  pins: [
    { name: 'pos', label: '+' },
    { name: 'neg', label: '−' },
  ],
  params: {
    mode: enumParam(LOAD_MODES, undefined, {
      label: 'Mode',
      description: '"resistance", "current" or "power".',
    }),
    value: requiredNumber({
      label: 'Value',
      unit: '',
      description: 'Ω in resistance mode, A (drawn from pos to neg) in current mode, W in power mode.',
    }),
    minVoltage: defaultNumber(0.1, {
      label: 'Minimum voltage (power mode)',
      unit: 'V',
      rule: { kind: 'positive' },
      sweepable: false,
      description: 'Below this voltage a constant-power load behaves as the resistance minVoltage²/value.',
      advanced: true,
    }),
  },
  crossCheck: (p) => {
    const v = p.value;
    if (typeof v !== 'number') return [];
    if (p.mode === 'resistance' && !(v > 0)) return [['value', `must be a positive number of ohms in resistance mode (got ${v})`]];
    if (p.mode === 'power' && !(v >= 0)) return [['value', `must be zero or a positive number of watts in power mode (got ${v})`]];
    return [];
  },
});

/** Unit of a load's value for a given mode. */
export function loadValueUnit(mode: string): string {
  return mode === 'resistance' ? 'Ω' : mode === 'current' ? 'A' : mode === 'power' ? 'W' : '';
}
