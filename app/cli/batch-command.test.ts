import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { planBatch } from './batch-command';

// Demo data: temp folders and a tiny project; expected messages are this project's pinned wording.
const root = mkdtempSync(join(tmpdir(), 'eggline-plan-'));
const input = join(root, 'in');
mkdirSync(input);
const project = (files: Record<string, unknown>): string => JSON.stringify({
  schema: 'eggline-project', version: 1, folder: '.', settings: DEFAULT_SETTINGS, files,
});
writeFileSync(join(input, 'eggline-project.json'), project({ 'a.tif': { axis: null, landmarks: [{ name: 'furrow', point: { x: 1, y: 2 } }], fitRangeEl: null } }));
writeFileSync(join(root, 'other-project.json'), project({}));
writeFileSync(join(root, 'channels-project.json'), JSON.stringify({
  schema: 'eggline-project', version: 1, folder: '.', settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2], fitRangeEl: [0.2, 0.5] }, files: {},
}));
writeFileSync(join(root, 'broken.json'), '{ nope');
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('planBatch', () => {
  it('uses <folder>/eggline-project.json by default and says so', async () => {
    const plan = await planBatch([input, '--out', join(root, 'out')]);
    if (plan === 'help') throw new Error('unexpected help');
    expect(Object.keys(plan.doc?.files ?? {})).toEqual(['a.tif']);
    expect(plan.projectFile).toBe(join(input, 'eggline-project.json'));
    expect(plan.notes[0]).toBe(`using hand edits from ${join(input, 'eggline-project.json')} (found in the input folder; --no-project to ignore)`);
  });
  it('--project picks another file, --no-project ignores the default', async () => {
    const other = await planBatch([input, '--out', join(root, 'out'), '--project', join(root, 'other-project.json')]);
    expect(other !== 'help' && other.projectFile).toBe(join(root, 'other-project.json'));
    const none = await planBatch([input, '--out', join(root, 'out'), '--no-project']);
    expect(none !== 'help' && [none.doc, none.projectFile, none.notes]).toEqual([null, null, []]);
  });
  it('takes settings from the project, then the flags over them', async () => {
    const plan = await planBatch([input, '--out', join(root, 'o'), '--project', join(root, 'channels-project.json'), '--fit-range', '0.1,0.7']);
    if (plan === 'help') throw new Error('unexpected help');
    expect([plan.settings.boundaryChannels, plan.settings.fitRangeEl]).toEqual([[2], [0.1, 0.7]]);
  });
  it('rejects a missing or broken project file naming it', async () => {
    await expect(planBatch([input, '--out', join(root, 'o'), '--project', join(root, 'missing.json')]))
      .rejects.toThrow(`project file not found: ${join(root, 'missing.json')}`);
    await expect(planBatch([input, '--out', join(root, 'o'), '--project', join(root, 'broken.json')])).rejects.toThrow(/^broken\.json: /);
  });
  it('parses jobs, timeout, repeated boundary channels and projection slices', async () => {
    const plan = await planBatch([input, '--out', join(root, 'o'), '--jobs', '3', '--file-timeout', '30', '--boundary-channel', '2',
      '--boundary-channel', 'stripes', '--projection', 'slice:5', '--no-project']);
    if (plan === 'help') throw new Error('unexpected help');
    expect([plan.jobs, plan.timeoutS, plan.settings.boundaryChannels, plan.settings.projection, plan.settings.sliceIndex])
      .toEqual([3, 30, [2, 'stripes'], 'slice', 5]);
    expect(await planBatch(['--help'])).toBe('help');
  });
  it('gives a flag\'s own rule for a negative number written as a separate word', async () => {
    // parseArgs alone would read "-3" as an option; the settings table's message names the rule instead.
    await expect(planBatch([input, '--out', join(root, 'o'), '--edge-depth', '-3'])).rejects.toThrow('--edge-depth must be a positive number of µm (got "-3")');
    await expect(planBatch([input, '--out', join(root, 'o'), '--strip-width', '-.5'])).rejects.toThrow('--strip-width must be a positive number of µm (got "-.5")');
    await expect(planBatch([input, '--out', join(root, 'o'), '--jobs', '-2'])).rejects.toThrow('--jobs must be a whole number from 1 to 256 (got "-2")');
  });
  it('--background-condition goes with --samples to the cohort step', async () => {
    writeFileSync(join(root, 'samples.csv'), 'file,condition\na.tif,null-stain\n');
    const plan = await planBatch([input, '--out', join(root, 'o'), '--samples', join(root, 'samples.csv'), '--background-condition', 'null-stain']);
    expect(plan !== 'help' && plan.cohort.backgroundCondition).toBe('null-stain');
    await expect(planBatch([input, '--out', join(root, 'o'), '--background-condition', 'null-stain'])).rejects.toThrow('--background-condition needs --samples');
  });
});
