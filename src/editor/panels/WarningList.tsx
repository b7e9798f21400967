// Findings of the solve (engine warnings and the editor's safety cautions), worst first.
// Clicking one selects the part it is about.
import { useEditor } from '../EditorContext';
import { severityRank } from '../solve/solveView';
import type { SolveWarning } from '../solve/resultTypes';

const TONE = ['text-danger', 'text-danger', 'text-caution', 'text-ink-muted'];
const WORD = ['Danger', 'Warning', 'Caution', 'Note'];

export function WarningList({ warnings, compact = false }: { warnings: SolveWarning[]; compact?: boolean }) {
  const editor = useEditor();
  if (!warnings.length) return null;
  return (
    <ul className="flex flex-col gap-1.5" aria-label="Findings">
      {warnings.map((w, i) => {
        const rank = severityRank(w.severity);
        const body = (
          <>
            <span className={`mr-1.5 text-[10px] font-bold uppercase tracking-wider ${TONE[rank]}`}>{WORD[rank]}</span>
            {/* name the part unless the message already starts with it */}
            {!compact && w.partId && !w.message.startsWith(w.partId) && <span className="num mr-1.5 font-semibold">{w.partId}</span>}
            {!compact && !w.partId && w.net && <span className="num mr-1.5 font-semibold">net {w.net}</span>}
            <span>{w.message}</span>
          </>
        );
        return (
          <li key={`${w.code}-${w.partId ?? w.net ?? ''}-${i}`} className={`rounded border-l-2 bg-sunken/60 px-2 py-1.5 text-[12px] leading-snug ${rank <= 1 ? 'border-danger' : rank === 2 ? 'border-caution' : 'border-rule'}`}>
            {w.partId && !compact ? (
              <button
                type="button"
                className="w-full text-left hover:underline"
                onClick={() => editor.actions.select({ parts: [w.partId!] })}
                data-testid={`finding-${w.code}-${w.partId}`}
              >
                {body}
              </button>
            ) : (
              body
            )}
          </li>
        );
      })}
    </ul>
  );
}
