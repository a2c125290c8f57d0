import { describe, expect, it } from 'vitest';
import { SETTINGS } from '../../../core/settings';
import { PANEL_SETTING_KEYS } from './panel-keys';

// Source: core/settings' table (every setting there has a field in the window).
describe('settings panel', () => {
  it('has a field for every setting of the table, and no other', () => {
    expect([...PANEL_SETTING_KEYS].sort()).toEqual(SETTINGS.map((s) => s.key).sort());
  });
});
