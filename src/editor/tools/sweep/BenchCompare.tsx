// Bench measurements against the sweep: load a CSV, say which column is the swept quantity and
// which output each reading column is, and see measured vs simulated with the deviations.
import { useMemo, useState } from 'react';
import { useToolSession } from '../results/toolSession';
import { fmtPct, fmtQ } from '../format';
import { Button, Field, inputClass, Section } from '../ui';
import { guessMapping, parseBenchCsv, type BenchMapping } from './benchData';
import { compareWithCurve } from './deviation';
import { measuredPairs } from './plotModel';
import type { SweepData } from './sweepData';

export function BenchCompare({ data, outputs, outside }: { data: SweepData; outputs: string[]; outside: number }) {
  const bench = useToolSession((s) => s.bench);
  const [error, setError] = useState<string | null>(null);

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    try {
      const table = parseBenchCsv(await file.text(), file.name);
      useToolSession.setState({ bench: { table, mapping: guessMapping(table, data.x.key, outputs) } });
      setError(null);
    } catch (e) {
      setError((e as Error).message);
    }
  };
  const setMapping = (m: BenchMapping) => bench && useToolSession.setState({ bench: { ...bench, mapping: m } });

  const comparisons = useMemo(() => {
    if (!bench) return [];
    return Object.entries(bench.mapping.yColumns)
      .filter(([, o]) => data.curves[o])
      .map(([col, output]) => {
        const p = measuredPairs(bench.table, bench.mapping, Number(col));
        // a family sweep compares with its first curve: measurements are taken at one setting
        const summary = compareWithCurve(data.x.values, data.curves[output][0], p.x, p.y, data.x.scale === 'log');
        return { column: bench.table.columns[Number(col)], output, unit: data.units[output] ?? '', summary };
      });
  }, [bench, data]);

  return (
    <Section
      title="Bench measurements"
      actions={
        <>
          <label className="inline-flex h-7 cursor-pointer items-center rounded border border-rule px-2.5 text-sm font-medium hover:bg-sunken">
            Load CSV…
            <input type="file" accept=".csv,.tsv,.txt,text/csv" className="sr-only" onChange={(e) => void onFile(e.target.files?.[0])} data-testid="bench-file" />
          </label>
          {bench && <Button onClick={() => useToolSession.setState({ bench: null })}>Clear</Button>}
        </>
      }
    >
      {error && <p className="text-xs text-danger" role="alert">{error}</p>}
      {!bench && !error && (
        <p className="text-xs text-ink-muted">
          A CSV with a header row: one column for the swept quantity ({data.x.key}{data.x.unit ? `, in ${data.x.unit}` : ''}) and one per reading, e.g.{' '}
          <code className="num">position,V(tap)</code>. Values may carry prefixes (4.7k, 12m).
        </p>
      )}
      {bench && (
        <div data-testid="bench-compare">
          <p className="mb-1 text-xs text-ink-muted">
            {bench.table.fileName}: {bench.table.rows} row{bench.table.rows === 1 ? '' : 's'}. {bench.table.notes.join(' ')}
            {outside > 0 && ` ${outside} reading${outside === 1 ? '' : 's'} lie outside the swept range and are not compared.`}
          </p>
          <div className="mb-2 flex flex-wrap gap-2">
            <Field label="Swept quantity column">
              <select className={inputClass} value={bench.mapping.xColumn} onChange={(e) => setMapping({ ...bench.mapping, xColumn: Number(e.target.value) })}>
                {bench.table.columns.map((c, i) => (
                  <option key={i} value={i}>{c}</option>
                ))}
              </select>
            </Field>
            {bench.table.columns.map((c, i) =>
              i === bench.mapping.xColumn ? null : (
                <Field key={i} label={`“${c}” is`}>
                  <select
                    className={inputClass}
                    value={bench.mapping.yColumns[i] ?? ''}
                    onChange={(e) => {
                      const y = { ...bench.mapping.yColumns };
                      if (e.target.value) y[i] = e.target.value;
                      else delete y[i];
                      setMapping({ ...bench.mapping, yColumns: y });
                    }}
                  >
                    <option value="">not compared</option>
                    {outputs.map((o) => (
                      <option key={o} value={o}>{o}</option>
                    ))}
                  </select>
                </Field>
              ),
            )}
          </div>
          {comparisons.map((c) => (
            <div key={c.column} className="mb-2">
              <p className="mb-1 text-xs" data-testid="deviation-summary">
                <span className="font-medium">{c.column}</span> vs {c.output}: max deviation{' '}
                <span className="num font-semibold">{fmtQ(c.summary.maxAbs, c.unit)}</span> (at {fmtQ(c.summary.maxAt, data.x.unit)}), RMS{' '}
                <span className="num font-semibold">{fmtQ(c.summary.rms, c.unit)}</span>, mean offset <span className="num">{fmtQ(c.summary.mean, c.unit)}</span> over{' '}
                {c.summary.compared} reading{c.summary.compared === 1 ? '' : 's'}.
              </p>
              <div className="max-h-48 overflow-auto">
                <table className="tl-table num" data-testid="deviation-table">
                  <thead>
                    <tr>
                      <th>{data.x.key}</th>
                      <th className="r">measured</th>
                      <th className="r">simulated</th>
                      <th className="r">deviation</th>
                      <th className="r">relative</th>
                    </tr>
                  </thead>
                  <tbody>
                    {c.summary.rows.map((r, i) => (
                      <tr key={i}>
                        <td>{fmtQ(r.x, data.x.unit)}</td>
                        <td className="r">{fmtQ(r.measured, c.unit)}</td>
                        <td className="r">{Number.isFinite(r.simulated) ? fmtQ(r.simulated, c.unit) : 'outside sweep'}</td>
                        <td className="r">{fmtQ(r.deviation, c.unit)}</td>
                        <td className="r">{fmtPct(r.relative, 3)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </div>
          ))}
        </div>
      )}
    </Section>
  );
}
