// The validated property fields of one part (react-hook-form + zod). A field commits on Enter or
// when it loses focus; bad input is explained under the field and never reaches the sheet.
import { useMemo, useState } from 'react';
import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Part } from '../../../shared/sheet';
import type { ParamInfo } from '../../../shared/parts/types';
import { useEditor, useEditorState } from '../EditorContext';
import { commitField, formParams, formSchema, formValues, type FormValues } from './paramFormModel';
import { fieldUnit } from '../format/values';
import { ESeriesButtons } from './ESeriesButtons';

export function ParamForm({ part }: { part: Part }) {
  const editor = useEditor();
  const readOnly = useEditorState((s) => s.session.readOnly);
  const params = part.params as Record<string, unknown>;
  const fields = useMemo(() => formParams(part.type), [part.type]);
  const resolver = useMemo(() => zodResolver(formSchema(part.type)), [part.type]);
  const values = useMemo(() => formValues(part.type, params), [part.type, params]);
  const [showAdvanced, setShowAdvanced] = useState(false);
  const form = useForm<FormValues>({
    resolver,
    values,
    resetOptions: { keepDirtyValues: true },
    mode: 'onBlur',
    reValidateMode: 'onChange',
  });
  const { errors } = form.formState;

  const commit = async (name: string) => {
    if (!(await form.trigger(name))) return;
    const raw = form.getValues(name);
    const r = commitField(part.type, name, raw);
    if (!r.ok) return form.setError(name, { message: r.message });
    const info = fields.find((f) => f.name === name)!;
    editor.actions.setParams(part.id, r.values, `Set ${part.id} ${info.label.toLowerCase()}`);
    // show the canonical form of what was stored ("4k7" → "4.7k")
    const fresh = formValues(part.type, { ...params, ...r.values });
    for (const key of Object.keys(r.values)) form.resetField(key, { defaultValue: fresh[key] });
  };

  const field = (info: ParamInfo) => {
    const id = `param-${part.id}-${info.name}`;
    const error = errors[info.name]?.message as string | undefined;
    const reg = form.register(info.name);
    const hint = info.required ? '' : info.default === undefined ? 'optional' : '';
    return (
      <div key={info.name} className="grid grid-cols-[7.5rem_1fr] items-start gap-x-2 gap-y-0.5">
        <label htmlFor={id} className="pt-1 text-[12px] leading-tight text-ink-muted" title={info.description}>
          {info.label}
        </label>
        <div className="min-w-0">
          {info.kind === 'boolean' ? (
            <input
              id={id}
              type="checkbox"
              disabled={readOnly}
              className="mt-1.5 h-4 w-4 accent-[var(--tl-accent)]"
              {...withCommit(reg, () => void commit(info.name), 'change')}
            />
          ) : info.kind === 'enum' ? (
            <select
              id={id}
              disabled={readOnly}
              className="w-full rounded border border-rule bg-panel px-1.5 py-1 text-[13px]"
              {...withCommit(reg, () => void commit(info.name), 'change')}
            >
              {info.enumValues?.map((v) => <option key={v} value={v}>{v}</option>)}
            </select>
          ) : (
            <div className="flex items-center gap-1">
              <div className={`flex min-w-0 flex-1 items-center rounded border bg-panel focus-within:border-accent ${error ? 'border-danger' : 'border-rule'}`}>
                <input
                  id={id}
                  disabled={readOnly}
                  autoComplete="off"
                  spellCheck={false}
                  placeholder={hint}
                  aria-invalid={!!error}
                  aria-describedby={error ? `${id}-error` : undefined}
                  className={`num min-w-0 flex-1 bg-transparent px-1.5 py-1 text-[13px] outline-none ${info.kind === 'string' ? 'font-sans' : ''}`}
                  onKeyDown={(e) => {
                    if (e.key === 'Enter') void commit(info.name);
                    if (e.key === 'Escape') form.resetField(info.name);
                  }}
                  {...withCommit(reg, () => void commit(info.name), 'blur')}
                />
                {fieldUnit(info) && <span className="num pr-1.5 text-[12px] text-ink-muted">{fieldUnit(info)}</span>}
              </div>
              {info.unit === 'Ω' && !info.toleranceOf && !readOnly && (
                <ESeriesButtons part={part} param={info.name} value={params[info.name]} />
              )}
            </div>
          )}
          {error && (
            <p id={`${id}-error`} role="alert" className="mt-0.5 text-[11px] leading-snug text-danger">
              {error}
            </p>
          )}
        </div>
      </div>
    );
  };

  const basic = fields.filter((f) => !f.advanced);
  const advanced = fields.filter((f) => f.advanced);
  return (
    <form className="flex flex-col gap-2" onSubmit={(e) => e.preventDefault()} aria-label={`${part.id} parameters`}>
      {basic.map(field)}
      {advanced.length > 0 && (
        <div className="mt-1">
          <button type="button" className="text-[12px] text-accent hover:underline" onClick={() => setShowAdvanced((v) => !v)} aria-expanded={showAdvanced}>
            {showAdvanced ? '▾' : '▸'} Model details ({advanced.length})
          </button>
          {showAdvanced && <div className="mt-2 flex flex-col gap-2">{advanced.map(field)}</div>}
        </div>
      )}
    </form>
  );
}

/** Chain react-hook-form's handler with a commit on blur or change. */
function withCommit(reg: UseFormRegisterReturn, commit: () => void, on: 'blur' | 'change'): UseFormRegisterReturn {
  if (on === 'blur')
    return {
      ...reg,
      onBlur: async (e) => {
        await reg.onBlur(e);
        commit();
      },
    };
  return {
    ...reg,
    onChange: async (e) => {
      await reg.onChange(e);
      commit();
    },
  };
}
