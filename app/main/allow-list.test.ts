import { describe, it, expect } from 'vitest';
import { join, resolve } from 'node:path';
import { createPathAllowList, isInsideFolder } from './allow-list';
import { API_INVOKE_METHODS, type EgglineApi } from '../../core/contract';

const root = resolve('/data/run');

describe('path allow-list', () => {
  it('allows exact files and whole trees, per use', () => {
    const allow = createPathAllowList();
    allow.allowFile('read', join(root, 'a.tif'));
    allow.allowTree('output', join(root, 'out'));
    expect(allow.isAllowed('read', join(root, 'a.tif'))).toBe(true);
    expect(allow.isAllowed('read', join(root, 'b.tif'))).toBe(false);
    expect(allow.isAllowed('output', join(root, 'out', 'deep', 'x.csv'))).toBe(true);
    expect(allow.isAllowed('read', join(root, 'out', 'x.csv'))).toBe(false);
    expect(allow.isAllowed('project', join(root, 'a.tif'))).toBe(false);
  });

  it('does not treat a sibling with the same prefix, a relative path or a NUL as inside', () => {
    const allow = createPathAllowList();
    allow.allowTree('read', root);
    expect(allow.isAllowed('read', resolve('/data/run2/x.tif'))).toBe(false);
    expect(allow.isAllowed('read', join(root, '..', 'run2', 'x.tif'))).toBe(false);
    expect(allow.isAllowed('read', 'run/x.tif')).toBe(false);
    expect(allow.isAllowed('read', `${join(root, 'x.tif')}\0.png`)).toBe(false);
    expect(allow.isAllowed('read', join(root, 'sub', '..', 'x.tif'))).toBe(true);
  });

  it('knows what inside means', () => {
    expect(isInsideFolder(root, root)).toBe(true);
    expect(isInsideFolder(root, join(root, 'a', 'b'))).toBe(true);
    expect(isInsideFolder(root, resolve('/data/run2'))).toBe(false);
    expect(isInsideFolder(root, resolve('/data'))).toBe(false);
  });

  it('the IPC method list covers every invoke method of the contract', () => {
    // Compile-time check: a contract method missing from API_INVOKE_METHODS fails the type check of this file.
    type Invoked = (typeof API_INVOKE_METHODS)[number];
    type Expected = Exclude<keyof EgglineApi, 'onBatchProgress' | 'onMenuCommand' | 'onMovieProgress' | 'pathForDroppedFile'>;
    const covered: [Expected] extends [Invoked] ? true : false = true;
    expect(covered).toBe(true);
    expect(new Set(API_INVOKE_METHODS).size).toBe(API_INVOKE_METHODS.length);
  });
});
