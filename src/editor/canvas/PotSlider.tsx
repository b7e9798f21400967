// The wiper slider drawn on a potentiometer. A pull of the slider is one undo step.
import { useRef } from 'react';
import type { Part } from '../../../shared/sheet';
import { useEditor, useEditorState } from '../EditorContext';

export function PotSlider({ part, wide = false }: { part: Part; wide?: boolean }) {
  const editor = useEditor();
  const readOnly = useEditorState((s) => s.session.readOnly);
  const pulling = useRef(false);
  const position = Number((part.params as { position?: number }).position ?? 0.5);
  const start = () => {
    if (pulling.current) return;
    pulling.current = true;
    editor.actions.beginContinuous(`Turn ${part.id}`);
  };
  const stop = () => {
    if (!pulling.current) return;
    pulling.current = false;
    editor.actions.endContinuous();
  };
  return (
    <label className={`pointer-events-auto flex items-center gap-1 ${wide ? 'w-full' : ''}`}>
      <input
        type="range"
        min={0}
        max={1}
        step={0.001}
        value={position}
        disabled={readOnly}
        className={`tl-slider nodrag nopan nowheel ${wide ? 'flex-1' : 'w-20'}`}
        aria-label={`${part.id} wiper position`}
        data-testid={wide ? `panel-pot-slider-${part.id}` : `pot-slider-${part.id}`}
        onPointerDown={start}
        onPointerUp={stop}
        onPointerCancel={stop}
        onBlur={stop}
        onChange={(e) => editor.actions.setParam(part.id, 'position', Number(e.target.value), `Turn ${part.id}`)}
      />
      <span className="num w-9 text-right text-[10px] text-ink-muted">{Math.round(position * 100)} %</span>
    </label>
  );
}
