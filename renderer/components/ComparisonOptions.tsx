// The cohort step's options in the Cohort tab ("Comparison options"): reference and background condition, profile
// normalisation, equivalence margin and an opposing posterior gradient's decay length. The values are checked with
// the command line's rules and wording (core/settings); the numbers are recomputed in the main process, never here.
// Each change is an ordinary project edit: Undo and Redo step through it like the window's other edits.
import { useEffect, useState } from 'react';
import type { ProjectCohortOptions } from '../../core/contract';
import { NO_BACKGROUND_CONDITION, type Normalisation } from '../../core/cohort';
import { COHORT_NORMALISATIONS, equivalenceMarginProblem, lambdaPosteriorElProblem } from '../../core/settings';

/** What the window says for each normalisation (the first is the default). */
const NORMALISATION_LABELS: Record<Normalisation, string> = {
  'scale-offset': 'scale and offset fitted onto the mean (default)',
  none: 'raw intensities, not rescaled',
  amplitude: 'divided by the fitted amplitude A',
  minmax: 'min–max scaled to [0, 1]',
};

/** Read a number field: empty is "none"; otherwise the number, or the flag's message. */
export function numberField(text: string, flag: string, problem: (v: number) => string | null): { value: number | null } | { problem: string } {
  const t = text.trim();
  if (t === '') return { value: null };
  const v = Number(t);
  const p = problem(v);
  return p === null ? { value: v } : { problem: `${flag} ${p.replace(' (x/EL)', '')} (got "${t}")` };
}

/** `options` with `key` set, or left out when `value` is null/empty (the default then holds). */
function withOption<K extends keyof ProjectCohortOptions>(options: ProjectCohortOptions, key: K, value: ProjectCohortOptions[K] | null | ''): ProjectCohortOptions {
  const { [key]: _old, ...rest } = options;
  return value === null || value === '' || value === undefined ? rest : { ...rest, [key]: value };
}

interface NumberOptionProps {
  readonly id: string; readonly label: string; readonly flag: string; readonly hint: string; readonly value: number | undefined;
  readonly problem: (v: number) => string | null; readonly onValue: (v: number | null) => void;
}

/** A number option: empty means none; taken on Enter or when the field is left; a bad value shows the flag's rule. */
function NumberOption({ id, label, flag, hint, value, problem, onValue }: NumberOptionProps) {
  const [text, setText] = useState(value === undefined ? '' : String(value));
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => { setText(value === undefined ? '' : String(value)); setMessage(null); }, [value]);
  const commit = () => {
    const r = numberField(text, flag, problem);
    if ('problem' in r) { setMessage(r.problem); return; }
    setMessage(null);
    if (r.value !== (value ?? null)) onValue(r.value);
  };
  return (
    <label className="comparison-option">
      <span>{label}</span>
      <input data-testid={id} type="text" inputMode="decimal" value={text} placeholder="none" title={hint} aria-invalid={message !== null}
        onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
      {message !== null && <span className="error small" role="alert" data-testid={`${id}-problem`}>{message}</span>}
    </label>
  );
}

/** The column a covariate entry names (`stage:numeric` → stage). */
function columnOf(entry: string): string {
  return entry.replace(/:(numeric|categorical)$/i, '').trim();
}

/** Covariates: a tick per free column of the sheet (the role column is not one); a column kept in the project but not
 *  in this sheet stays listed. A column is numeric when every value is a number, else categorical (its first level in
 *  the sheet is the base), as `--covariate COLUMN` takes it. */
function CovariateChoice({ chosen, columns, onChosen }: { chosen: readonly string[]; columns: readonly string[]; onChosen: (list: string[]) => void }) {
  const offered = [...columns.filter((c) => c.toLowerCase() !== 'role'), ...chosen.map(columnOf).filter((c) => !columns.includes(c))];
  return (
    <div className="comparison-option" data-testid="cohort-opt-covariates"
      title="Adjust the dosage regression for sample-sheet columns: their coefficients are estimated within conditions and each position is moved to the columns' mean before the condition means are fitted on ln f (dosage_fit.csv, covariates.csv)">
      <span>Covariates (dosage regression)</span>
      {offered.length === 0 ? <span className="muted small">none: the sample sheet has no free columns (e.g. stage, batch)</span>
        : offered.map((c) => {
          const entry = chosen.find((e) => columnOf(e) === c);
          const kind = entry === undefined ? '' : entry.slice(columnOf(entry).length).replace(/^:/, '').toLowerCase();
          return (
            <span key={c} className="covariate-row">
              <label className="small covariate">
                <input type="checkbox" data-testid="cohort-opt-covariate" data-column={c} checked={entry !== undefined}
                  onChange={() => onChosen(entry !== undefined ? chosen.filter((e) => columnOf(e) !== c) : [...chosen, c])} /> {c}
              </label>
              {entry !== undefined && (
                <select className="small" data-testid="cohort-opt-covariate-kind" data-column={c} value={kind} aria-label={`how ${c} is read`}
                  onChange={(e) => onChosen(chosen.map((x) => (columnOf(x) === c ? (e.target.value === '' ? c : `${c}:${e.target.value}`) : x)))}>
                  <option value="">numbers: numeric</option>
                  <option value="numeric">numeric</option>
                  <option value="categorical">categorical (labels)</option>
                </select>)}
            </span>
          );
        })}
    </div>
  );
}

/** Props: the project's options, the sheet's conditions, and where a change goes. */
export interface ComparisonOptionsProps {
  readonly options: ProjectCohortOptions;
  readonly conditions: readonly string[];
  /** The sample sheet's free columns, offered as covariates (absent: none). */
  readonly columns?: readonly string[];
  readonly busy: boolean;
  readonly onChange: (options: ProjectCohortOptions) => void;
}

/** The options area of the Cohort tab; every change is saved in the project and recomputes the comparison. */
export function ComparisonOptions({ options, conditions, columns = [], busy, onChange }: ComparisonOptionsProps) {
  // A condition kept in the project but not in this sheet stays listed, so the choice is visible and can be changed.
  // "none" is a choice (subtract nothing), not a condition.
  const names = [...conditions, ...[options.reference, options.backgroundCondition].filter((n): n is string => n !== undefined && n !== NO_BACKGROUND_CONDITION && !conditions.includes(n))];
  return (
    <fieldset className="comparison-options" data-testid="cohort-options" aria-busy={busy}>
      <legend>Comparison options <span className="muted small">saved in the project; <code>eggline cohort --project</code> and <code>eggline batch</code> use them{busy ? ' · recomputing…' : ''}</span></legend>
      <label className="comparison-option">
        <span>Reference condition</span>
        <select data-testid="cohort-opt-reference" value={options.reference ?? ''} onChange={(e) => onChange(withOption(options, 'reference', e.target.value))}>
          <option value="">the one with dosage 1 (default)</option>
          {names.filter((n) => n !== options.backgroundCondition).map((n) => <option key={n} value={n}>{n}</option>)}
        </select>
      </label>
      <label className="comparison-option">
        <span>Background condition</span>
        <select data-testid="cohort-opt-background" value={options.backgroundCondition ?? ''} title="From the sample sheet: the condition its role column marks background, else none. A condition of null or secondary-only stainings: its mean profile is subtracted from every other embryo's, and λ and boundaries are fitted again; none: nothing is subtracted (a condition the sheet's role column marks stays out of the comparison)"
          onChange={(e) => onChange(withOption(options, 'backgroundCondition', e.target.value))}>
          <option value="">from the sample sheet (default)</option>
          <option value={NO_BACKGROUND_CONDITION}>none: subtract nothing</option>
          {names.filter((n) => n !== options.reference && n !== NO_BACKGROUND_CONDITION).map((n) => <option key={n} value={n}>{n}</option>)}
        </select>
      </label>
      <label className="comparison-option">
        <span>Profile normalisation</span>
        <select data-testid="cohort-opt-normalisation" value={options.normalisation ?? 'scale-offset'}
          onChange={(e) => onChange(withOption(options, 'normalisation', e.target.value === 'scale-offset' ? null : e.target.value as Normalisation))}>
          {COHORT_NORMALISATIONS.map((n) => <option key={n} value={n}>{`${n}: ${NORMALISATION_LABELS[n]}`}</option>)}
        </select>
      </label>
      <NumberOption id="cohort-opt-margin" label="Equivalence margin (0–1)" flag="Equivalence margin" value={options.equivalenceMargin} problem={equivalenceMarginProblem}
        hint="Also test whether observed/predicted lies within 1 ± M (two one-sided tests); empty: no equivalence test"
        onValue={(v) => onChange(withOption(options, 'equivalenceMargin', v))} />
      <NumberOption id="cohort-opt-lambda-p" label="Opposing posterior gradient λ (x/EL)" flag="Posterior gradient λ" value={options.lambdaPosteriorEl} problem={lambdaPosteriorElProblem}
        hint="Decay length of an opposing posterior gradient: adds the two-gradient prediction Δx = ln f / (1/λ_A + 1/λ_P); empty: none"
        onValue={(v) => onChange(withOption(options, 'lambdaPosteriorEl', v))} />
      <CovariateChoice chosen={options.covariates ?? []} columns={columns} onChosen={(list) => onChange(withOption(options, 'covariates', list.length === 0 ? null : list))} />
    </fieldset>
  );
}
