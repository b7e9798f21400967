// The sheet as the tools see it (the editor's document, corners not applied: analyses vary
// tolerances themselves) and its electrical key, for marking results that no longer match.
import { useMemo } from 'react';
import { useEditorState } from '../EditorContext';
import { electricalKey } from '../solve/liveSolve';
import type { Sheet } from '../../../shared/sheet';

export function useToolSheet(): { sheet: Sheet; key: string } {
  const sheet = useEditorState((s) => s.doc);
  const key = useMemo(() => electricalKey(sheet), [sheet]);
  return { sheet, key };
}
