// Toolbar menu: the sheet as a file, as pictures, its parts list, and the printable report.
import { useRef, useState } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { useReactFlow } from '@xyflow/react';
import { useEditor } from '../../EditorContext';
import { notify } from '../../notices';
import { flushToolSession, useToolSession } from '../results/toolSession';
import { downloadDataUrl, downloadText, fileStem } from './download';
import { partsListCsvOf, sheetJson } from './sheetFiles';
import { schematicPng, schematicSvg } from './canvasPicture';

/** Where the report of the sheet open at `pathname` lives: /sheets/x → /sheets/x/report. */
export function reportPath(pathname: string): string {
  return `${pathname.replace(/\/+$/, '')}/report`;
}

export function ExportMenu() {
  const editor = useEditor();
  const rf = useReactFlow();
  const navigate = useNavigate();
  const { pathname } = useLocation();
  const menu = useRef<HTMLDetailsElement>(null);
  const [busy, setBusy] = useState(false);
  const doc = () => editor.getDoc();
  const stem = () => fileStem(doc().title);
  const close = () => menu.current?.removeAttribute('open');

  const picture = async (kind: 'png' | 'svg') => {
    close();
    setBusy(true);
    try {
      const root = document.querySelector('[data-testid="schematic-canvas"]') ?? document;
      const url = kind === 'png' ? await schematicPng(root, rf.getNodes()) : await schematicSvg(root, rf.getNodes());
      downloadDataUrl(url, `${stem()}.${kind}`);
    } catch (e) {
      notify(`Could not make the picture: ${(e as Error).message}`, 'error');
    } finally {
      setBusy(false);
    }
  };
  const item = 'block w-full px-3 py-1.5 text-left text-[13px] hover:bg-sunken';
  return (
    <details ref={menu} className="relative">
      <summary className="flex h-7 cursor-pointer list-none items-center rounded px-2 text-[12px] text-ink-muted hover:bg-sunken hover:text-ink" data-testid="export-menu" aria-busy={busy}>
        {busy ? 'Exporting…' : 'Export ▾'}
      </summary>
      <div className="absolute right-0 z-40 mt-1 w-64 rounded border border-rule bg-panel py-1 shadow-lg" role="menu">
        <button type="button" role="menuitem" className={item} data-testid="export-json" onClick={() => (close(), downloadText(sheetJson(doc()), `${stem()}.tapline.json`, 'application/json'))}>
          Sheet file (.json)
        </button>
        <button type="button" role="menuitem" className={item} data-testid="export-svg" onClick={() => void picture('svg')}>
          Schematic picture (SVG)
        </button>
        <button type="button" role="menuitem" className={item} data-testid="export-png" onClick={() => void picture('png')}>
          Schematic picture (PNG)
        </button>
        <button type="button" role="menuitem" className={item} data-testid="export-parts-csv" onClick={() => (close(), downloadText(partsListCsvOf(doc()), `${stem()}-parts.csv`, 'text/csv'))}>
          Parts list (CSV)
        </button>
        <hr className="my-1 border-rule" />
        <button
          type="button"
          role="menuitem"
          className={item}
          data-testid="open-report"
          onClick={() => {
            close();
            // the report shows the sheet as it is now and the runs made in this tab
            useToolSession.setState({ sheet: doc() });
            flushToolSession();
            navigate(reportPath(pathname));
          }}
        >
          Design report (print / PDF)…
        </button>
      </div>
    </details>
  );
}
