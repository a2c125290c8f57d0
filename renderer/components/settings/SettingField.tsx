// One field per analysis setting, described and checked by core/settings' table: its label, its help line as the
// tooltip, and a bad value refused at the field with the table's rule (the rule the command line states), so the
// project never takes a value it could not save.
import { useEffect, useState } from 'react';
import {
  fieldProblem, numberFromText, overrideOf, settingSpec, settingValue, type AnalysisSettings, type SettingsOverrides,
} from '../../../core/settings';

/** Props shared by the fields: the settings shown and how to change them. */
export interface SettingFieldProps {
  readonly settings: AnalysisSettings;
  readonly onChange: (patch: SettingsOverrides) => void;
}

/** The number (or null for an empty nullable field) a field's text stands for; the text itself when it is not one. */
export function valueFromText(text: string, nullable: boolean): unknown {
  if (text.trim() === '') return nullable ? null : text;
  return numberFromText(text) ?? text;
}

/** The text a field shows for a value. */
const textOf = (v: unknown): string => (v === null || v === undefined ? '' : String(v));

/** A field's text and its refusal message, reset when the value changes from outside. */
function useFieldText(value: unknown): [string, (t: string) => void, string | null, (m: string | null) => void] {
  const [text, setText] = useState(textOf(value));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setText(textOf(value)); setError(null); }, [value]);
  return [text, setText, error, setError];
}

/** The field's frame: label, the control, and the refusal message under it. */
export function FieldFrame({ label, help, error, testId, children }: { label: string; help: string; error: string | null; testId: string; children: React.ReactNode }) {
  return (
    <label className={`field${error ? ' invalid' : ''}`} title={error ?? help} data-testid={`field-${testId}`}>
      <span>{label}</span>
      {children}
      {error && <em className="field-error" role="alert" data-testid={`field-error-${testId}`}>{error}</em>}
    </label>
  );
}

/** A number setting (`key` in the table), committed on Enter or blur when the table's rule allows it. */
export function NumberSetting({ settingKey, settings, onChange, extra }: SettingFieldProps & { settingKey: string; extra?: (v: unknown) => SettingsOverrides }) {
  const spec = settingSpec(settingKey);
  const value = settingValue(settings, settingKey);
  const [text, setText, error, setError] = useFieldText(value);
  const testId = spec.flag.slice(2);
  const commit = (): void => {
    const v = valueFromText(text, spec.nullable === true);
    const problem = fieldProblem(settingKey, v);
    setError(problem);
    if (problem === null && v !== value) onChange({ ...overrideOf(settingKey, v), ...extra?.(v) });
  };
  return (
    <FieldFrame label={spec.label} help={spec.help} error={error} testId={testId}>
      <input type="text" inputMode="decimal" value={text} data-testid={testId} aria-invalid={error !== null}
        onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
    </FieldFrame>
  );
}

/** A setting with a fixed set of words, as a drop-down; `names` gives friendlier option labels. */
export function ChoiceSetting({ settingKey, settings, onChange, names = {}, extra }: SettingFieldProps & {
  settingKey: string; names?: Readonly<Record<string, string>>; extra?: (v: string) => SettingsOverrides;
}) {
  const spec = settingSpec(settingKey);
  const testId = spec.flag.slice(2);
  return (
    <FieldFrame label={spec.label} help={spec.help} error={null} testId={testId}>
      <select value={String(settingValue(settings, settingKey))} data-testid={testId}
        onChange={(e) => onChange({ ...overrideOf(settingKey, e.target.value), ...extra?.(e.target.value) })}>
        {(spec.choices ?? []).map((c) => <option key={c} value={c}>{names[c] ?? c}</option>)}
      </select>
    </FieldFrame>
  );
}

/** An image-file setting (a path; empty = none), committed on Enter or blur when the table's rule allows it. */
export function FileSetting({ settingKey, settings, onChange }: SettingFieldProps & { settingKey: string }) {
  const spec = settingSpec(settingKey);
  const value = settingValue(settings, settingKey);
  const [text, setText, error, setError] = useFieldText(value);
  const testId = spec.flag.slice(2);
  const commit = (): void => {
    const v = text.trim() === '' ? null : text.trim();
    const problem = fieldProblem(settingKey, v);
    setError(problem);
    if (problem === null && v !== value) onChange(overrideOf(settingKey, v));
  };
  return (
    <FieldFrame label={spec.label} help={`${spec.help}; a relative path is taken from the project's folder; empty = none`} error={error} testId={testId}>
      <input type="text" value={text} data-testid={testId} aria-invalid={error !== null} placeholder="none"
        onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
    </FieldFrame>
  );
}
