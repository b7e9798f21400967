// Choose what to measure: checkboxes grouped by net voltage, current and power.
import { useState } from 'react';
import type { OutputChoice } from './sweep/outputChoices';

export function OutputPicker({ choices, selected, onChange, max = 6, testId }: { choices: readonly OutputChoice[]; selected: readonly string[]; onChange: (next: string[]) => void; max?: number; testId: string }) {
  const [showAll, setShowAll] = useState(false);
  const groups = ['Net voltage', 'Current', 'Power'] as const;
  const toggle = (key: string) => {
    if (selected.includes(key)) onChange(selected.filter((k) => k !== key));
    else if (selected.length < max) onChange([...selected, key]);
  };
  return (
    <fieldset className="text-xs" data-testid={testId}>
      <legend className="mb-1 text-ink-muted">
        Outputs <span className="text-[11px]">(up to {max})</span>
      </legend>
      {groups.map((g) => {
        const list = choices.filter((c) => c.group === g);
        if (!list.length || (!showAll && g !== 'Net voltage' && !list.some((c) => selected.includes(c.key)))) return null;
        return (
          <div key={g} className="mb-1 flex flex-wrap gap-x-2 gap-y-0.5">
            <span className="w-full text-[11px] text-ink-muted">{g}</span>
            {list.map((c) => (
              <label key={c.key} className="num inline-flex items-center gap-1">
                <input type="checkbox" checked={selected.includes(c.key)} onChange={() => toggle(c.key)} disabled={!selected.includes(c.key) && selected.length >= max} />
                {c.key}
              </label>
            ))}
          </div>
        );
      })}
      <button type="button" className="text-[11px] text-accent underline" onClick={() => setShowAll((v) => !v)}>
        {showAll ? 'Show net voltages only' : 'Show currents and powers'}
      </button>
    </fieldset>
  );
}
