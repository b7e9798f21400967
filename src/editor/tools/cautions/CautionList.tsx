// Cautions as a list: danger first, each with the part it concerns.
import type { ToolCaution } from './toolCautions';

export function CautionList({ cautions, testId = 'tool-cautions' }: { cautions: readonly ToolCaution[]; testId?: string }) {
  if (!cautions.length) return null;
  return (
    <ul className="flex flex-col gap-1" data-testid={testId}>
      {cautions.map((c, i) => (
        <li
          key={`${c.code}-${c.partId ?? ''}-${i}`}
          className={`rounded border-l-4 bg-sunken px-2 py-1 text-xs ${c.severity === 'danger' ? 'border-danger' : 'border-caution'}`}
          role={c.severity === 'danger' ? 'alert' : undefined}
        >
          <span className={`mr-1 font-semibold ${c.severity === 'danger' ? 'text-danger' : 'text-caution'}`}>{c.severity === 'danger' ? 'Danger' : 'Caution'}</span>
          {c.message}
        </li>
      ))}
    </ul>
  );
}
