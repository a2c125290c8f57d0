import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtemp, readFile, writeFile, readdir, rm, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { ProjectDoc } from '../../core/contract';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { cleanInterruptedSaves, loadProject, loadProjectOrBackup, saveProject, projectKeyFor, pathForProjectKey } from './project-file';
import { newProject } from './new-project';

let dir: string;
beforeEach(async () => { dir = await mkdtemp(join(tmpdir(), 'eggline-project-')); });
afterEach(async () => { await rm(dir, { recursive: true, force: true }); });

// Demo data: an invented project with one hand-corrected axis and one landmark.
function demoDoc(folder: string): ProjectDoc {
  return {
    ...newProject(folder),
    settings: { ...DEFAULT_SETTINGS, fitRangeEl: [0.15, 0.55] },
    files: {
      'sub/embryo-01.ome.tif': {
        axis: { anterior: { x: 10.5, y: 20 }, posterior: { x: 300, y: 41.25 }, source: 'hand' },
        landmarks: [{ name: 'furrow', point: { x: 120, y: 33 } }],
        fitRangeEl: [0.2, 0.5],
      },
    },
  };
}

describe('project files', () => {
  it('saves and reopens exactly (folder absolute in memory, relative on disk)', async () => {
    const path = join(dir, 'eggline-project.json');
    const doc = demoDoc(dir);
    await saveProject(path, doc);
    expect(await loadProject(path)).toEqual(doc);
    const onDisk = JSON.parse(await readFile(path, 'utf8'));
    expect(onDisk.folder).toBe('.');
    expect(Object.keys(onDisk.files)).toEqual(['sub/embryo-01.ome.tif']);
  });

  it('keeps the previous version as .bak and leaves no temp files', async () => {
    const path = join(dir, 'eggline-project.json');
    const first = demoDoc(dir);
    await saveProject(path, first);
    await saveProject(path, { ...first, files: {} });
    expect(await loadProject(`${path}.bak`)).toEqual(first);
    expect((await loadProject(path)).files).toEqual({});
    expect((await readdir(dir)).sort()).toEqual(['eggline-project.json', 'eggline-project.json.bak']);
  });

  it('stores absolute file keys inside the folder as relative ones', async () => {
    const path = join(dir, 'p.json');
    const doc = demoDoc(dir);
    const abs = join(dir, 'a.tif');
    await saveProject(path, { ...doc, files: { [abs]: doc.files['sub/embryo-01.ome.tif'] } });
    expect(Object.keys((await loadProject(path)).files)).toEqual(['a.tif']);
  });

  it('opens only a project whose folder is the folder it sits in (a moved folder with its project still opens)', async () => {
    await mkdir(join(dir, 'images'));
    const path = join(dir, 'p.json');
    await saveProject(path, demoDoc(join(dir, 'images')));
    expect(JSON.parse(await readFile(path, 'utf8')).folder).toBe('images');
    await expect(loadProject(path)).rejects.toThrow('p.json: its folder must be the folder the project file is in (".") but is "images"');
    await writeFile(path, JSON.stringify({ ...JSON.parse(await readFile(path, 'utf8')), folder: '/' }));
    await expect(loadProject(path)).rejects.toThrow('p.json: its folder must be the folder the project file is in (".") but is "/"');
    const moved = join(dir, 'images', 'eggline-project.json');
    await saveProject(moved, demoDoc(join(dir, 'images')));
    expect((await loadProject(moved)).folder).toBe(join(dir, 'images'));
  });

  it('falls back to the backup when the project file is unreadable, saying so; fails when both are', async () => {
    const path = join(dir, 'eggline-project.json');
    await saveProject(path, demoDoc(dir));
    await saveProject(path, { ...demoDoc(dir), files: {} });
    await writeFile(path, '{"schema": "eggline-proj'); // cut by a crash (demo data)
    const loaded = await loadProjectOrBackup(path);
    expect(Object.keys(loaded.doc.files)).toEqual(['sub/embryo-01.ome.tif']);
    expect(loaded.doc.folder).toBe(dir);
    expect(loaded.warning).toMatch(/^eggline-project\.json is unreadable \(not valid JSON \(.+\)\); opened its backup eggline-project\.json\.bak instead, so the latest edits may be missing$/);
    await writeFile(`${path}.bak`, 'garbage');
    await expect(loadProjectOrBackup(path)).rejects.toThrow(/^eggline-project\.json: not valid JSON/);
  });

  it('removes the temporary files of interrupted saves, but not those of a save still running', async () => {
    const path = join(dir, 'eggline-project.json');
    await saveProject(path, demoDoc(dir));
    // PIDs above the Linux maximum (2**22, from memory: proc(5) pid_max) belong to no process.
    const dead = ['.eggline-project.json.4999999.0a1b2c3d.tmp', '.eggline-project.json.bak.4999998.00ff00ff.tmp'];
    const live = `.eggline-project.json.${process.ppid}.12345678.tmp`;
    for (const f of [...dead, live, '.other.json.4999999.0a1b2c3d.tmp']) await writeFile(join(dir, f), 'partial');
    expect((await cleanInterruptedSaves(path)).sort()).toEqual([...dead].sort());
    expect((await readdir(dir)).sort()).toEqual(['.eggline-project.json.' + process.ppid + '.12345678.tmp', '.other.json.4999999.0a1b2c3d.tmp', 'eggline-project.json']);
  });

  it('refuses corrupt and foreign files with one-line messages naming the file', async () => {
    const path = join(dir, 'broken.json');
    await writeFile(path, '{"schema": "eggline-project", "version": 1, ');
    await expect(loadProject(path)).rejects.toThrow(/^broken\.json: not valid JSON \(/);
    await writeFile(path, JSON.stringify({ schema: 'something-else', version: 1 }));
    await expect(loadProject(path)).rejects.toThrow(
      "broken.json: schema must be 'eggline-project' (found \"something-else\"); this is not an Eggline project");
  });

  it('refuses a newer version instead of half-reading it', async () => {
    const path = join(dir, 'future.json');
    await writeFile(path, JSON.stringify({ ...demoDoc(dir), folder: '.', version: 3 }));
    await expect(loadProject(path)).rejects.toThrow(
      'future.json: version is 3, newer than this Eggline reads (2); update Eggline to open it');
  });

  it('names the bad field', async () => {
    const path = join(dir, 'p.json');
    const doc = demoDoc(dir);
    await writeFile(path, JSON.stringify({ ...doc, folder: '.', settings: { ...doc.settings, fitRangeEl: [0.6, 0.2] } }));
    await expect(loadProject(path)).rejects.toThrow('p.json: settings.fitRangeEl must be two numbers [a, b] with 0 ≤ a < b ≤ 1');
    const badLandmark = { ...doc.files['sub/embryo-01.ome.tif'], landmarks: [{ name: '', point: { x: 1, y: 2 } }] };
    await writeFile(path, JSON.stringify({ ...doc, folder: '.', files: { 'a.tif': badLandmark } }));
    await expect(loadProject(path)).rejects.toThrow('p.json: files["a.tif"].landmarks[0].name must be a non-empty text');
  });

  it('fills settings missing from an older file with the defaults', async () => {
    const path = join(dir, 'p.json');
    await writeFile(path, JSON.stringify({ schema: 'eggline-project', version: 1, folder: '.', settings: { projection: 'max' } }));
    const doc = await loadProject(path);
    expect(doc.settings).toEqual({ ...DEFAULT_SETTINGS, projection: 'max' });
    expect(doc.files).toEqual({});
  });

  it('maps file keys to paths and back', () => {
    expect(projectKeyFor(dir, join(dir, 'x', 'y.tif'))).toBe('x/y.tif');
    expect(pathForProjectKey(dir, 'x/y.tif')).toBe(join(dir, 'x', 'y.tif'));
    expect(projectKeyFor(join(dir, 'x'), join(dir, 'z.tif'))).toBe(join(dir, 'z.tif'));
  });
});
