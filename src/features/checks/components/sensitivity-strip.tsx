// The verdict across cell sizes and area bases side by side: does the conclusion hold when the choices change?
import type { CheckRequestInput, SensitivityRow } from '@shared/schemas/checks.ts';
import { Button } from '../../../components/button.tsx';
import { Panel } from '../../../components/page-frame.tsx';
import { ErrorState } from '../../../components/query-states.tsx';
import { useRunSensitivity } from '../api/run-sensitivity.ts';
import { fixed, metres, pText } from '../utils/figures.ts';
import { spreadLabels } from '../../../lib/spread-labels.ts';
import type { SpreadVerdict } from '@shared/analysis/spread.ts';

const bases = [
  { key: 'boundary', label: 'Field boundary' },
  { key: 'bbox', label: 'Bounding rectangle' },
  { key: 'hull', label: 'Convex hull' },
] as const;

const verdictTone: Record<SpreadVerdict, string> = {
  clustered: 'bg-patch-100 text-patch-700',
  random: 'bg-field-50 text-field-800',
  regular: 'bg-straw-100 text-soil-800',
  'too-few': 'bg-soil-300/30 text-soil-700',
  everywhere: 'bg-patch-100 text-patch-700',
  'cant-tell': 'bg-soil-300/30 text-soil-700',
};

function StripCell({ row }: { row: SensitivityRow | undefined }) {
  if (!row) return <td className="px-2 py-1.5 text-soil-400">—</td>;
  if (!row.verdict) return <td className="px-2 py-1.5 text-xs text-patch-700">{row.error ?? 'Could not run'}</td>;
  return (
    <td className="px-2 py-1.5 align-top" data-sensitivity={`${row.areaBasis}-${row.cellSizeFactor}`}>
      <span className={`inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${verdictTone[row.verdict]}`}>{spreadLabels[row.verdict]}</span>
      <span className="mt-0.5 block text-[11px] tabular-nums text-soil-700">
        R {fixed(row.donnellyR, 2)} · MC p {pText(row.monteCarloPValue)} · χ² p {pText(row.quadratPValue)}
      </span>
    </td>
  );
}

export function SensitivityStrip({ request }: { request: CheckRequestInput | null }) {
  const strip = useRunSensitivity();
  const rows = strip.data?.rows ?? [];
  const factors = [...new Set(rows.map((r) => r.cellSizeFactor))].sort((a, b) => a - b);
  const verdicts = new Set(rows.filter((r) => r.verdict).map((r) => r.verdict));
  return (
    <Panel
      title="How robust is the verdict?"
      actions={
        <Button variant="secondary" size="sm" disabled={!request} busy={strip.isPending} onClick={() => request && strip.mutate(request)}>
          {strip.data ? 'Run again' : 'Test robustness'}
        </Button>
      }
    >
      <p className="mb-2 text-xs text-soil-600">
        The same sightings checked with half, the same and double the quadrat cell size, on three area bases
        {strip.data ? `, ${strip.data.simulations} simulations each` : ''}. The spacing R and its Monte Carlo p change with the area; χ² changes with the cells.
      </p>
      {strip.isError && <ErrorState error={strip.error} />}
      {rows.length > 0 && (
        <>
          <p className={`mb-2 text-sm font-medium ${verdicts.size === 1 ? 'text-field-800' : 'text-patch-700'}`} role="status">
            {verdicts.size === 1
              ? `The verdict holds: ${spreadLabels[[...verdicts][0]!]} in every variant.`
              : 'The verdict changes with the choices: read the figures before deciding, and prefer the field boundary.'}
          </p>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Verdict by area basis and cell size</caption>
              <thead className="bg-straw-100 text-xs text-soil-700">
                <tr>
                  <th scope="col" className="px-2 py-1.5">
                    Area basis
                  </th>
                  {factors.map((f) => (
                    <th key={f} scope="col" className="px-2 py-1.5">
                      Cells × {f} ({metres(rows.find((r) => r.cellSizeFactor === f)?.cellSizeM, 0)})
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="divide-y divide-straw-200">
                {bases.map((b) => (
                  <tr key={b.key}>
                    <th scope="row" className="px-2 py-1.5 font-medium text-soil-800">
                      {b.label}
                    </th>
                    {factors.map((f) => (
                      <StripCell key={f} row={rows.find((r) => r.areaBasis === b.key && r.cellSizeFactor === f)} />
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
    </Panel>
  );
}
