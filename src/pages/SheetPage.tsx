import { useParams } from 'react-router-dom';

// Placeholder until the schematic editor lands.
export function SheetPage() {
  const { id } = useParams();
  return (
    <div className="p-6">
      <h1 className="text-xl font-semibold">Sheet <span className="num">{id}</span></h1>
      <p className="mt-2 text-ink-muted">The schematic editor is being built.</p>
    </div>
  );
}
