// The example sheets in examples/ (demo data), offered as starting points for a new project.
const files = import.meta.glob('../../examples/*.json', { eager: true, import: 'default' }) as Record<string, unknown>;

export interface ExampleSheet {
  name: string;
  title: string;
  sheet: unknown;
}

export const exampleSheets: ExampleSheet[] = Object.entries(files)
  .map(([path, sheet]) => {
    const name = path.split('/').pop()!.replace(/\.json$/, '');
    const title = typeof (sheet as { title?: unknown }).title === 'string' ? (sheet as { title: string }).title : name;
    return { name, title, sheet };
  })
  .sort((a, b) => a.title.localeCompare(b.title));
