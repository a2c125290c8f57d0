// Static checks of the renderer page (no browser needed).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

const html = readFileSync(join(ROOT, 'renderer/index.html'), 'utf8');

describe('renderer/index.html', () => {
  it('carries the agreed Content-Security-Policy', () => {
    // Source: the project brief's CSP line (no inline scripts, images from self, blob: and data:).
    expect(html).toContain(`content="default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; img-src 'self' blob: data:; worker-src 'self' blob:"`);
  });
  it('has no inline scripts: every script tag has a src', () => {
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toMatch(/\ssrc="/);
  });
});
