// The numbers of the live measurement: λ ± SE, 95% CI, R², A, B, each side's λ and their difference (when measured
// apart), egg length, boundaries, warnings.
import type { EmbryoResult, ExponentialFit, SidesMeasurement } from '../../core/model';
import type { LiveMeasurement } from '../live';
import type { FileStatus } from '../state/fileStatus';
import { fixed, fmt } from '../ui/format';

/** The shown file: its status and its row of the last batch. */
export interface ShownFile {
  readonly name: string;
  readonly status: FileStatus;
  readonly result: EmbryoResult | null;
}

/** Props of the numbers panel. */
export interface FitNumbersProps {
  readonly m: LiveMeasurement | null;
  readonly pixelSizeUm: number | null;
  readonly loading: boolean;
  /** Where the shown axis comes from (the negative-λ hint depends on it). */
  readonly axisSource: 'auto' | 'hand' | null;
  readonly file: ShownFile | null;
  /** Why the shown time point is not the settings' one (a file with fewer time points), as the batch's row says it. */
  readonly timePointWarning?: string | null;
  /** The settings' fit range, x/EL, when the file uses its own instead (null when it follows the settings). */
  readonly settingsFitRangeEl?: readonly [number, number] | null;
  /** This file's own dorsal side (null: the shared setting's, `sharedDorsalSide`), and how to change it. */
  readonly dorsal?: {
    readonly own: 'left' | 'right' | null;
    readonly shared: 'left' | 'right';
    readonly onChange: (side: 'left' | 'right' | null) => void;
  } | null;
}

/** This file's dorsal side: the shared setting, or left/right of A→P for a flipped or mirrored embryo. */
export function DorsalSideControl({ own, shared, onChange }: NonNullable<FitNumbersProps['dorsal']>) {
  return (
    <label className="field" title="which side of the A→P line is dorsal in this file; the edge band and the overlay follow it; saved in the project">
      <span>dorsal side (this file)</span>
      <select data-testid="file-dorsal-side" value={own ?? 'shared'}
        onChange={(e) => onChange(e.target.value === 'shared' ? null : (e.target.value as 'left' | 'right'))}>
        <option value="shared">as the settings ({shared === 'left' ? 'left' : 'right'} of A→P)</option>
        <option value="left">left of A→P</option>
        <option value="right">right of A→P</option>
      </select>
    </label>
  );
}

/** A row of the numbers panel: label, value, test id, and an optional note in small type under the value with the
 *  fit it describes (its numbers are also given in full as data attributes). */
export type NumberRow = readonly [string, string, string?, string?, ExponentialFit?];

/** A signed number with a true minus sign. */
const signed = (v: number, decimals: number): string => fixed(v, decimals).replace(/^-/, '\u2212');

/** The sentence under an interval on which of λ's two standard errors it rests, both of them, the residuals' lag-1
 *  correlation and, for one side's own fit, the depth term; every number is the fit's own (as the batch writes it). */
export function intervalSourceText(f: ExponentialFit): string {
  const model = `model SE ${fmt(f.lambdaSeModelUm, 2)} µm`;
  const serial = Number.isFinite(f.lambdaSeSerialUm)
    ? `serial-correlation SE ${fmt(f.lambdaSeSerialUm, 2)} µm` : 'serial-correlation SE not computable';
  const lag = `residual lag-1 r = ${signed(f.residualLag1, 2)}`;
  const text = f.lambdaSeSource === 'serial'
    ? `interval from the ${serial} (${lag}); ${model}`
    : `interval from the ${model}; ${serial} (${lag})`;
  return f.depthTermEl === undefined ? text : `${text}; plus depth term ${fixed(f.depthTermEl, 4)} EL in quadrature`;
}

/** Tooltip of the sentence above. */
export const INTERVAL_SOURCE_TIP = 'The interval uses the wider of the two SEs: residuals that are correlated along the axis make the model SE too small, and the wider one keeps the interval from claiming more than the profile shows.';

/** Rows of the numbers panel for each side measured on its own and their paired difference (none when not measured). */
export function sideNumberRows(sides: SidesMeasurement | null | undefined): NumberRow[] {
  if (!sides) return [];
  const side = (f: ExponentialFit | null): string => (f === null ? 'fit failed'
    : `${fmt(f.lambdaUm)} ± ${fmt(f.lambdaSeUm, 2)} µm (${fmt(f.lambdaCiLowUm)} – ${fmt(f.lambdaCiHighUm)})`);
  const d = sides.difference;
  const inUm = d !== null && Number.isFinite(d.lambdaUm);
  return [
    ['λ dorsal', side(sides.dorsalFit), 'lambda-dorsal', sides.dorsalFit === null ? undefined : intervalSourceText(sides.dorsalFit), sides.dorsalFit ?? undefined],
    ['λ ventral', side(sides.ventralFit), 'lambda-ventral', sides.ventralFit === null ? undefined : intervalSourceText(sides.ventralFit), sides.ventralFit ?? undefined],
    ['dorsal − ventral', d === null ? '—' : inUm
      ? `${fmt(d.lambdaUm)} ± ${fmt(d.seUm, 2)} µm (95% CI ${fmt(d.ciLowUm)} – ${fmt(d.ciHighUm)})`
      : `${fixed(d.lambdaEl, 4)} ± ${fixed(d.seEl, 4)} EL (95% CI ${fixed(d.ciLowEl, 4)} – ${fixed(d.ciHighEl, 4)})`, 'lambda-difference'],
    ['sides\' error corr.', d === null ? '—' : `${fixed(d.sideCorrelation, 2)} (${d.seSource} SE)`, 'side-correlation'],
  ];
}

/** Why λ can come out negative, and what to check: with the automatic axis the anterior pole is already the high end
 *  of the gradient channel, so the channel is the likelier culprit; with a hand axis, the poles may be swapped. */
export function negativeLambdaHint(axisSource: 'auto' | 'hand' | null): string {
  return axisSource === 'hand'
    ? 'λ is negative: the profile rises toward P. Are anterior and posterior swapped (S)? Or is the gradient channel not the graded one?'
    : 'λ is negative: the profile rises toward P although the automatic axis puts A at the bright end. Check the gradient channel in the settings (the graded channel may be another one), then the axis.';
}

/** Status line of the shown file and what the last batch said about it. */
function FileNote({ file }: { file: ShownFile }) {
  const r = file.result;
  return (
    <div className="file-note" data-testid="file-note">
      <div className="row"><span className={`status status-${file.status.state}`}>{file.status.label}</span><span className="muted small">{file.status.reason}</span></div>
      {r !== null && r.status === 'ok' && r.warnings.length > 0 && (
        <ul className="warnings" data-testid="batch-warnings" aria-label="warnings of the last batch">{r.warnings.map((w, i) => <li key={i}>last batch: {w}</li>)}</ul>
      )}
    </div>
  );
}

/** Table of fit results for the shown embryo. */
export function FitNumbers({ m, pixelSizeUm, loading, axisSource, file, timePointWarning = null, settingsFitRangeEl = null, dorsal = null }: FitNumbersProps) {
  const f = m?.fit ?? null;
  const rows: NumberRow[] = [
    ['λ', f === null ? '—' : `${fmt(f.lambdaUm)} ± ${fmt(f.lambdaSeUm, 2)} µm`, 'lambda-um'],
    ['λ / EL', f === null ? '—' : `${fixed(f.lambdaEl, 4)} ± ${fixed(f.lambdaSeEl, 4)}`, 'lambda-el'],
    ['95% CI', f === null ? '—' : `${fmt(f.lambdaCiLowUm)} – ${fmt(f.lambdaCiHighUm)} µm`, 'lambda-ci', f === null ? undefined : intervalSourceText(f), f ?? undefined],
    ['R²', f === null ? '—' : fixed(f.r2, 4), 'r2'],
    ['A', f === null ? '—' : `${fmt(f.amplitude)} ± ${fmt(f.amplitudeSe, 2)}`],
    ['B', f === null ? '—' : `${fmt(f.background)} ± ${fmt(f.backgroundSe, 2)}`],
    ['fit range', f === null ? '—' : `${fixed(f.fitRangeEl[0], 3)} – ${fixed(f.fitRangeEl[1], 3)} EL (${f.dof + 3} bins)${settingsFitRangeEl === null ? '' : ` · this file's own (settings: ${fixed(settingsFitRangeEl[0], 2)} – ${fixed(settingsFitRangeEl[1], 2)})`}`, 'fit-range'],
    ...sideNumberRows(m?.sides),
    ['egg length', m === null ? '—' : `${fmt(m.eggLengthUm, 4)} µm`],
    ['pixel size', pixelSizeUm === null ? 'unknown' : `${fmt(pixelSizeUm, 4)} µm`],
  ];
  return (
    <section className="panel fit-numbers" data-testid="fit-numbers">
      <h3>Gradient fit <span className="muted">A·e^(−x/λ)+B{loading ? ' · loading…' : ''}</span></h3>
      {file !== null && <FileNote file={file} />}
      {file !== null && dorsal !== null && <DorsalSideControl {...dorsal} />}
      <table><tbody>
        {rows.map(([k, v, id, note, nf]) => [
          <tr key={k}><th>{k}</th><td data-testid={id} data-value={id === 'lambda-el' ? f?.lambdaEl : undefined}>{v}</td></tr>,
          note !== undefined && (
            <tr key={`${k}-source`} className="interval-source-row"><td colSpan={2}>
              <div className="muted small interval-source" data-testid={id === undefined ? undefined : `${id}-source`} title={INTERVAL_SOURCE_TIP}
                data-se-source={nf?.lambdaSeSource} data-se-model-um={nf?.lambdaSeModelUm} data-se-serial-um={nf?.lambdaSeSerialUm}
                data-lag1={nf?.residualLag1} data-depth-term-el={nf?.depthTermEl}>{note}</div>
            </td></tr>
          ),
        ])}
        {m?.boundaries.map((b, i) => <tr key={`b${i}`}><th>{b.channel} {b.method}</th><td>{b.positionEl === null ? (b.note ?? '—') : `${fixed(b.positionEl, 3)} EL · ${fmt(b.positionUm)} µm · ${b.direction}`}</td></tr>)}
      </tbody></table>
      {m !== null && (m.warnings.length > 0 || (f !== null && f.lambdaEl < 0) || timePointWarning !== null) && (
        <ul className="warnings" data-testid="warnings">
          {timePointWarning !== null && <li data-testid="time-point-warning">{timePointWarning}</li>}
          {f !== null && f.lambdaEl < 0 && <li data-testid="negative-lambda">{negativeLambdaHint(axisSource)}</li>}
          {m.warnings.map((w, i) => <li key={i}>{w}</li>)}
        </ul>
      )}
    </section>
  );
}
