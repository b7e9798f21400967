// The "Sheet" tab: title and the conditions every part is solved under (validated fields).
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useMemo } from 'react';
import { parseValue } from '../../../shared/units';
import { useEditor, useEditorState } from '../EditorContext';

const temperature = z.string().superRefine((t, ctx) => {
  const r = parseValue(t, { unit: '°C' });
  if (!r.ok) ctx.addIssue({ code: 'custom', message: r.message });
  else if (!(r.value > -273.15)) ctx.addIssue({ code: 'custom', message: 'A temperature must be above −273.15 °C.' });
});
const illuminance = z.string().superRefine((t, ctx) => {
  const r = parseValue(t, { unit: 'lx' });
  if (!r.ok) ctx.addIssue({ code: 'custom', message: r.message });
});
const schema = z.object({ title: z.string().max(120, 'Keep the title under 120 characters.'), temperatureC: temperature, illuminanceLux: illuminance });
type Values = z.infer<typeof schema>;

export function SheetPanel() {
  const editor = useEditor();
  const doc = useEditorState((s) => s.doc);
  const readOnly = useEditorState((s) => s.session.readOnly);
  const values = useMemo<Values>(
    () => ({ title: doc.title ?? '', temperatureC: String(doc.conditions.temperatureC), illuminanceLux: String(doc.conditions.illuminanceLux) }),
    [doc.title, doc.conditions],
  );
  const form = useForm<Values>({ resolver: zodResolver(schema), values, resetOptions: { keepDirtyValues: true }, mode: 'onBlur' });
  const { errors } = form.formState;
  const commit = async (name: keyof Values) => {
    if (!(await form.trigger(name))) return;
    const text = form.getValues(name);
    if (name === 'title') editor.actions.setTitle(text);
    else {
      const r = parseValue(text, { unit: name === 'temperatureC' ? '°C' : 'lx' });
      if (r.ok) editor.actions.setConditions({ [name]: r.value });
    }
    form.resetField(name, { defaultValue: text });
  };
  const row = (name: keyof Values, label: string, unit: string, help: string) => (
    <div className="grid grid-cols-[7.5rem_1fr] gap-x-2 gap-y-0.5">
      <label htmlFor={`sheet-${name}`} className="pt-1 text-[12px] text-ink-muted">{label}</label>
      <div>
        <div className={`flex items-center rounded border bg-panel focus-within:border-accent ${errors[name] ? 'border-danger' : 'border-rule'}`}>
          <input
            id={`sheet-${name}`}
            disabled={readOnly}
            className={`min-w-0 flex-1 bg-transparent px-1.5 py-1 text-[13px] outline-none ${name === 'title' ? '' : 'num'}`}
            aria-invalid={!!errors[name]}
            onKeyDown={(e) => e.key === 'Enter' && void commit(name)}
            {...form.register(name, { onBlur: () => void commit(name) })}
          />
          {unit && <span className="num pr-1.5 text-[12px] text-ink-muted">{unit}</span>}
        </div>
        {errors[name] ? <p role="alert" className="mt-0.5 text-[11px] text-danger">{errors[name]?.message}</p> : <p className="mt-0.5 text-[11px] text-ink-muted">{help}</p>}
      </div>
    </div>
  );
  return (
    <form className="flex flex-col gap-3 p-4" onSubmit={(e) => e.preventDefault()} aria-label="Sheet" data-testid="sheet-panel">
      {row('title', 'Title', '', 'Shown in the title bar and on exports.')}
      <h3 className="mt-1 text-[11px] font-semibold uppercase tracking-wider text-ink-muted">Conditions</h3>
      {row('temperatureC', 'Temperature', '°C', 'Ambient for every part without its own temperature.')}
      {row('illuminanceLux', 'Illuminance', 'lx', 'Light on every light sensor without its own value.')}
      {doc.description && <p className="text-[12px] leading-snug text-ink-muted">{doc.description}</p>}
    </form>
  );
}
