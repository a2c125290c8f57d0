import { describe, expect, it } from 'vitest';
import { fitText, progressBar, progressPrinter } from './progress';

// Source: demo data; expected strings are this project's progress format.
describe('progress output', () => {
  it('draws a bar of the given width', () => {
    expect(progressBar(0, 4, 8)).toBe('[--------] 0/4');
    expect(progressBar(1, 4, 8)).toBe('[##------] 1/4');
    expect(progressBar(4, 4, 8)).toBe('[########] 4/4');
    expect(progressBar(0, 0, 4)).toBe('[####] 0/0');
  });
  it('keeps the end of long names', () => {
    expect(fitText('abcdef', 10)).toBe('abcdef');
    expect(fitText('folder/embryo-01.tif', 10)).toBe('…yo-01.tif');
  });
  it('writes plain lines when stderr is not a terminal', () => {
    const lines: string[] = [];
    const io = { stdout: { write: () => true }, stderr: { write: (t: string) => lines.push(t) } };
    const p = progressPrinter(io);
    p.onProgress({ runId: 'r', done: 0, total: 2, file: 'a.tif', status: 'running', message: null });
    p.onProgress({ runId: 'r', done: 1, total: 2, file: 'a.tif', status: 'ok', message: null });
    p.onProgress({ runId: 'r', done: 2, total: 2, file: 'b.tif', status: 'error', message: 'b.tif: not a TIFF file' });
    p.end();
    expect(lines.join('')).toBe('[1/2] ok    a.tif\n[2/2] error b.tif: not a TIFF file\n');
  });
  it('redraws one bar in place on a terminal and prints errors above it', () => {
    let text = '';
    const io = { stdout: { write: () => true }, stderr: { isTTY: true, columns: 60, write: (t: string) => { text += t; } } };
    const p = progressPrinter(io);
    p.onProgress({ runId: 'r', done: 0, total: 2, file: 'a.tif', status: 'running', message: null });
    p.onProgress({ runId: 'r', done: 1, total: 2, file: 'a.tif', status: 'error', message: 'a.tif: empty file (0 bytes)' });
    p.end();
    expect(text).toBe(`\r\x1b[2K[------------------------] 0/2 a.tif\r\x1b[2K[1/2] error a.tif: empty file (0 bytes)\n`
      + `\r\x1b[2K[############------------] 1/2 a.tif\r\x1b[2K`);
  });
});
