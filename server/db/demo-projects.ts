// Demo projects (demo data: invented scenarios and people) for `npm start`, each with another mix
// of roles so a demo user sees projects they own, edit and only view.

interface DemoProject {
  id: string;
  title: string;
  /** file in examples/ */
  example: string;
  members: { login: string; role: 'owner' | 'editor' | 'viewer' }[];
  revisions?: string[];
}

export const demoProjects: DemoProject[] = [
  {
    id: 'de300000-0000-4000-8000-000000000001',
    title: 'Soil probe thermistor front end (demo)',
    example: 'ntc-front-end.json',
    members: [{ login: 'ada-demo', role: 'owner' }, { login: 'ben-demo', role: 'editor' }, { login: 'chen-demo', role: 'viewer' }],
    revisions: ['First draft for review (demo)'],
  },
  {
    id: 'de300000-0000-4000-8000-000000000002',
    title: '12 V battery monitor tap (demo)',
    example: 'battery-divider.json',
    members: [{ login: 'ben-demo', role: 'owner' }, { login: 'chen-demo', role: 'editor' }, { login: 'ada-demo', role: 'viewer' }],
  },
  {
    id: 'de300000-0000-4000-8000-000000000003',
    title: 'Four-resistor NPN bias network (demo)',
    example: 'npn-bias.json',
    members: [{ login: 'chen-demo', role: 'owner' }, { login: 'ada-demo', role: 'editor' }],
  },
  {
    id: 'de300000-0000-4000-8000-000000000004',
    title: '5.1 V Zener shunt reference (demo)',
    example: 'zener-reference.json',
    members: [{ login: 'ada-demo', role: 'owner' }],
  },
];

/** A 5 V into 10 kΩ / 10 kΩ divider, used when an example file is missing (demo data). */
export function fallbackSheet(title: string): Record<string, unknown> {
  return {
    format: 'tapline.sheet',
    version: 1,
    title,
    description: 'Demo data: a 5 V supply halved by two 10 kΩ resistors.',
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 }, position: { x: 80, y: 160 } },
      { id: 'R1', type: 'resistor', params: { resistance: 10000 }, position: { x: 240, y: 100 }, rotation: 90 },
      { id: 'R2', type: 'resistor', params: { resistance: 10000 }, position: { x: 240, y: 220 }, rotation: 90 },
      { id: 'GND1', type: 'ground', position: { x: 160, y: 320 } },
    ],
    wires: [
      { from: 'V1.pos', to: 'R1.a' },
      { from: 'R1.b', to: 'R2.a' },
      { from: 'R2.b', to: 'GND1.g' },
      { from: 'V1.neg', to: 'GND1.g' },
    ],
  };
}
