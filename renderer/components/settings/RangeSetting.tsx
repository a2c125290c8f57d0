// An x/EL range setting (the fit range, the boundary search window) as two numbers; a change that breaks the table's
// rule (e.g. "from" 0.7 with "to" 0.6) is refused at the field with the rule's message, and the project keeps the last
// good range (and keeps saving).
import { useEffect, useState } from 'react';
import { fieldProblem, overrideOf, settingSpec, settingValue } from '../../../core/settings';
import { FieldFrame, valueFromText, type SettingFieldProps } from './SettingField';

/** Both ends of the range setting `settingKey`. */
export function RangeSetting({ settingKey, settings, onChange }: SettingFieldProps & { settingKey: string }) {
  const spec = settingSpec(settingKey);
  const [lo, hi] = settingValue(settings, settingKey) as readonly [number, number];
  const testId = spec.flag.slice(2);
  const [texts, setTexts] = useState<[string, string]>([String(lo), String(hi)]);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setTexts([String(lo), String(hi)]); setError(null); }, [lo, hi]);
  const commit = (): void => {
    const range = texts.map((t) => valueFromText(t, false));
    const problem = fieldProblem(settingKey, range);
    setError(problem);
    if (problem === null && (range[0] !== lo || range[1] !== hi)) onChange(overrideOf(settingKey, [range[0], range[1]]));
  };
  const input = (i: 0 | 1) => (
    <input type="text" inputMode="decimal" value={texts[i]} data-testid={`${testId}-${i === 0 ? 'from' : 'to'}`} aria-invalid={error !== null}
      aria-label={`${spec.label} ${i === 0 ? 'from' : 'to'}`}
      onChange={(e) => setTexts(i === 0 ? [e.target.value, texts[1]] : [texts[0], e.target.value])}
      onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
  );
  return (
    <FieldFrame label={spec.label} help={spec.help} error={error} testId={testId}>
      <span className="range-inputs">{input(0)} – {input(1)}</span>
    </FieldFrame>
  );
}
