import { useLocation, useParams } from 'react-router-dom';
import { SheetEditor } from '../editor/SheetEditor';
import { registerBuiltinSources } from '../editor/sources/builtinSources';

registerBuiltinSources();

/**
 * /sheets/:id — the schematic editor. When the editor itself moves the sheet to another route
 * (an example saved as the local sheet) it passes `continuedFrom`, and the editor stays mounted.
 */
export function SheetPage() {
  const { id = 'local' } = useParams();
  const location = useLocation();
  const key = (location.state as { continuedFrom?: string } | null)?.continuedFrom ?? id;
  return <SheetEditor key={key} routeId={id} />;
}
