// A small argument parser shared by the CLI commands: positionals plus --flag / --flag=value /
// --flag value, each command declaring its flags so new commands can add their own.

export interface FlagSpec {
  name: string;
  /** takes a value (otherwise boolean) */
  value?: boolean;
  /** may be given more than once (values collected) */
  repeat?: boolean;
  description: string;
  valueName?: string;
}

export interface ParsedArgs {
  positionals: string[];
  flags: Record<string, string | boolean | string[]>;
}

export class UsageError extends Error {}

export function parseArgs(argv: readonly string[], specs: readonly FlagSpec[]): ParsedArgs {
  const positionals: string[] = [];
  const flags: ParsedArgs['flags'] = {};
  const byName = new Map(specs.map((s) => [s.name, s] as const));
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (!a.startsWith('--') || a === '-') {
      if (a.startsWith('-') && a !== '-' && a.length > 1) {
        if (a === '-h') {
          flags.help = true;
          continue;
        }
        throw new UsageError(`unknown option ${a}`);
      }
      positionals.push(a);
      continue;
    }
    const eq = a.indexOf('=');
    const name = a.slice(2, eq === -1 ? undefined : eq);
    const spec = byName.get(name);
    if (!spec) throw new UsageError(`unknown option --${name}`);
    let value: string | boolean = true;
    if (spec.value) {
      if (eq !== -1) value = a.slice(eq + 1);
      else if (i + 1 < argv.length) value = argv[++i];
      else throw new UsageError(`option --${name} needs a value`);
    } else if (eq !== -1) throw new UsageError(`option --${name} takes no value`);
    if (spec.repeat) {
      const prev = flags[name];
      flags[name] = [...(Array.isArray(prev) ? prev : []), String(value)];
    } else flags[name] = value;
  }
  return { positionals, flags };
}

export function formatFlags(specs: readonly FlagSpec[]): string {
  return specs
    .map((s) => {
      const left = `  --${s.name}${s.value ? ` ${s.valueName ?? 'VALUE'}` : ''}`;
      return `${left.padEnd(30)} ${s.description}`;
    })
    .join('\n');
}
