// A number input that commits on Enter or blur, refusing values outside [min, max] with a short message.
import { useEffect, useState } from 'react';

/** Props of a number field. */
export interface NumberFieldProps {
  readonly label: string;
  readonly value: number | null;
  readonly min?: number;
  readonly max?: number;
  readonly step?: number;
  readonly integer?: boolean;
  /** Allow an empty field, committed as null. */
  readonly nullable?: boolean;
  readonly onCommit: (v: number | null) => void;
  readonly testId?: string;
}

/** Check a typed value; returns the number (or null) or a one-line reason. */
export function parseField(text: string, p: Pick<NumberFieldProps, 'min' | 'max' | 'integer' | 'nullable' | 'label'>): number | null | string {
  if (text.trim() === '') return p.nullable ? null : `${p.label}: a number is needed`;
  const v = Number(text);
  if (!Number.isFinite(v)) return `${p.label}: "${text}" is not a number`;
  if (p.integer && !Number.isInteger(v)) return `${p.label}: must be a whole number`;
  if (p.min !== undefined && v < p.min) return `${p.label}: must be at least ${p.min}`;
  if (p.max !== undefined && v > p.max) return `${p.label}: must be at most ${p.max}`;
  return v;
}

/** The field. */
export function NumberField(p: NumberFieldProps) {
  const [text, setText] = useState(p.value === null ? '' : String(p.value));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setText(p.value === null ? '' : String(p.value)); setError(null); }, [p.value]);
  const commit = () => {
    const r = parseField(text, p);
    if (typeof r === 'string') { setError(r); return; }
    setError(null);
    if (r !== p.value) p.onCommit(r);
  };
  return (
    <label className={`field${error ? ' invalid' : ''}`} title={error ?? ''}>
      <span>{p.label}</span>
      <input type="number" value={text} step={p.step ?? 'any'} data-testid={p.testId}
        onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
      {error && <em className="field-error">{error}</em>}
    </label>
  );
}
