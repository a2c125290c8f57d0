// The fit range (x/EL) as two numbers; a change that breaks the table's rule (e.g. "from" 0.7 with "to" 0.6) is refused
// at the field with the rule's message, and the project keeps the last good range (and keeps saving).
import { useEffect, useState } from 'react';
import { fieldProblem, settingSpec } from '../../../core/settings';
import { FieldFrame, valueFromText, type SettingFieldProps } from './SettingField';

/** Both ends of the shared fit range. */
export function FitRangeSetting({ settings, onChange }: SettingFieldProps) {
  const spec = settingSpec('fitRangeEl');
  const [lo, hi] = settings.fitRangeEl;
  const [texts, setTexts] = useState<[string, string]>([String(lo), String(hi)]);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setTexts([String(lo), String(hi)]); setError(null); }, [lo, hi]);
  const commit = (): void => {
    const range = texts.map((t) => valueFromText(t, false));
    const problem = fieldProblem('fitRangeEl', range);
    setError(problem);
    if (problem === null && (range[0] !== lo || range[1] !== hi)) onChange({ fitRangeEl: [range[0] as number, range[1] as number] });
  };
  const input = (i: 0 | 1, testId: string) => (
    <input type="text" inputMode="decimal" value={texts[i]} data-testid={testId} aria-invalid={error !== null}
      aria-label={i === 0 ? 'fit from x/EL' : 'fit to x/EL'}
      onChange={(e) => setTexts(i === 0 ? [e.target.value, texts[1]] : [texts[0], e.target.value])}
      onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
  );
  return (
    <FieldFrame label={spec.label} help={spec.help} error={error} testId="fit-range">
      <span className="range-inputs">{input(0, 'fit-from')} – {input(1, 'fit-to')}</span>
    </FieldFrame>
  );
}
