import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, sep } from 'node:path';
import { resolveAppRequest, serveAppRequest } from '../../app/main/protocol';
import { CONTENT_SECURITY_POLICY } from '../../app/main/security';

let root: string;
let dist: string;
beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), 'eggline-protocol-'));
  dist = join(root, 'renderer');
  await mkdir(join(dist, 'assets'), { recursive: true });
  await writeFile(join(dist, 'index.html'), '<!doctype html><title>t</title>');
  await writeFile(join(dist, 'assets', 'main.js'), 'console.log(1)');
  await writeFile(join(root, 'secret.json'), '{"key": 1}');
  await writeFile(join(dist, 'tool.exe'), 'MZ');
});
afterAll(async () => { await rm(root, { recursive: true, force: true }); });

describe('eggline:// protocol', () => {
  it('serves files under dist/renderer with their type and the CSP', async () => {
    // Source: Electron security checklist item 18 (custom protocol instead of file://) and item 7 (CSP).
    const res = await serveAppRequest('eggline://app/assets/main.js', dist);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/javascript; charset=utf-8');
    expect(res.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(await res.text()).toBe('console.log(1)');
    expect(resolveAppRequest('eggline://app/', dist)).toEqual({ ok: true, filePath: join(dist, 'index.html'), mime: 'text/html; charset=utf-8' });
  });

  it.each([
    'eggline://app/../../secret.json',
    'eggline://app/%2e%2e/secret.json',
    'eggline://app/assets/%2E%2E/%2E%2E/secret.json',
    'eggline://app/..%2fsecret.json',
    'eggline://app/..%5csecret.json',
    'eggline://app/assets/%00.js',
  ])('never serves a file outside dist/renderer: %s', async (url) => {
    // Source: Electron security checklist item 18 (serve only your files; reject ".." in paths). Plain and %2e
    // dot segments are folded by URL parsing (WHATWG URL standard, path state, from memory) and so stay inside the
    // root; encoded separators and NUL survive parsing and are refused here.
    const r = resolveAppRequest(url, dist);
    if (r.ok) expect(r.filePath.startsWith(`${dist}${sep}`)).toBe(true);
    const res = await serveAppRequest(url, dist);
    expect([403, 404]).toContain(res.status);
  });

  it.each(['eggline://app/..%2fsecret.json', 'eggline://app/..%5csecret.json', 'eggline://app/assets/%00.js'])(
    'refuses encoded traversal with 403: %s', (url) => {
      expect(resolveAppRequest(url, dist)).toEqual({ ok: false, status: 403 });
    });

  it('rejects other hosts and schemes, unknown types and missing files', async () => {
    expect(resolveAppRequest('eggline://other/index.html', dist)).toEqual({ ok: false, status: 403 });
    expect(resolveAppRequest('file:///etc/passwd', dist)).toEqual({ ok: false, status: 403 });
    expect(resolveAppRequest('eggline://app/tool.exe', dist)).toEqual({ ok: false, status: 403 });
    expect(resolveAppRequest('eggline://app/%E0%A4%A.js', dist)).toEqual({ ok: false, status: 400 });
    expect((await serveAppRequest('eggline://app/missing.js', dist)).status).toBe(404);
  });
});
