// The numbers of the live measurement: λ ± SE, 95% CI, R², A, B, egg length, boundaries, warnings.
import type { LiveMeasurement } from '../live';
import { fixed, fmt } from '../ui/format';

/** Table of fit results for the shown embryo. */
export function FitNumbers({ m, pixelSizeUm, loading }: { m: LiveMeasurement | null; pixelSizeUm: number | null; loading: boolean }) {
  const f = m?.fit ?? null;
  const rows: [string, string, string?][] = [
    ['λ', f === null ? '—' : `${fmt(f.lambdaUm)} ± ${fmt(f.lambdaSeUm, 2)} µm`, 'lambda-um'],
    ['λ / EL', f === null ? '—' : `${fixed(f.lambdaEl, 4)} ± ${fixed(f.lambdaSeEl, 4)}`, 'lambda-el'],
    ['95% CI', f === null ? '—' : `${fmt(f.lambdaCiLowUm)} – ${fmt(f.lambdaCiHighUm)} µm`],
    ['R²', f === null ? '—' : fixed(f.r2, 4), 'r2'],
    ['A', f === null ? '—' : `${fmt(f.amplitude)} ± ${fmt(f.amplitudeSe, 2)}`],
    ['B', f === null ? '—' : `${fmt(f.background)} ± ${fmt(f.backgroundSe, 2)}`],
    ['fit range', f === null ? '—' : `${fixed(f.fitRangeEl[0], 3)} – ${fixed(f.fitRangeEl[1], 3)} EL (${f.dof + 3} bins)`],
    ['egg length', m === null ? '—' : `${fmt(m.eggLengthUm, 4)} µm`],
    ['pixel size', pixelSizeUm === null ? 'unknown' : `${fmt(pixelSizeUm, 4)} µm`],
  ];
  return (
    <section className="panel fit-numbers" data-testid="fit-numbers">
      <h3>Gradient fit <span className="muted">A·e^(−x/λ)+B{loading ? ' · loading…' : ''}</span></h3>
      <table><tbody>
        {rows.map(([k, v, id]) => <tr key={k}><th>{k}</th><td data-testid={id}>{v}</td></tr>)}
        {m?.boundaries.map((b, i) => <tr key={`b${i}`}><th>{b.channel} {b.method}</th><td>{b.positionEl === null ? (b.note ?? '—') : `${fixed(b.positionEl, 3)} EL · ${fmt(b.positionUm)} µm · ${b.direction}`}</td></tr>)}
      </tbody></table>
      {m !== null && (m.warnings.length > 0 || (f !== null && f.lambdaEl < 0)) && (
        <ul className="warnings" data-testid="warnings">
          {f !== null && f.lambdaEl < 0 && <li>λ is negative: the profile rises toward P. Are anterior and posterior swapped? (S)</li>}
          {m.warnings.map((w, i) => <li key={i}>{w}</li>)}
        </ul>
      )}
    </section>
  );
}
