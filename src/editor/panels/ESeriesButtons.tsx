// Snap a resistance to the chosen E-series (IEC 60063), or step to its neighbours.
import type { Part } from '../../../shared/sheet';
import { isPreferred, nearestPreferred, stepDown, stepUp } from '../../../shared/units';
import { useEditor, useEditorState } from '../EditorContext';

export function ESeriesButtons({ part, param, value }: { part: Part; param: string; value: unknown }) {
  const editor = useEditor();
  const series = useEditorState((s) => s.session.snapSeries);
  if (typeof value !== 'number' || !(value > 0)) return null;
  const preferred = isPreferred(value, series);
  const set = (v: number | null, what: string) => {
    if (v !== null && v !== value) editor.actions.setParam(part.id, param, v, `${what} ${part.id} to ${series}`);
  };
  const btn = 'num rounded border border-rule px-1 py-0.5 text-[11px] text-ink-muted hover:border-accent hover:text-ink';
  return (
    <div className="flex shrink-0 items-center gap-0.5">
      <button type="button" className={btn} onClick={() => set(stepDown(value, series), 'Step down')} aria-label={`Next lower ${series} value`} title={`Next lower ${series} value`}>
        −
      </button>
      <button
        type="button"
        className={`${btn} ${preferred ? 'text-ok' : ''}`}
        onClick={() => set(nearestPreferred(value, series), 'Snap')}
        aria-label={preferred ? `${series} value` : `Snap to nearest ${series} value`}
        title={preferred ? `Already an ${series} value` : `Snap to the nearest ${series} value`}
        data-testid={`snap-${part.id}-${param}`}
      >
        {preferred ? `${series} ✓` : series}
      </button>
      <button type="button" className={btn} onClick={() => set(stepUp(value, series), 'Step up')} aria-label={`Next higher ${series} value`} title={`Next higher ${series} value`}>
        +
      </button>
    </div>
  );
}
