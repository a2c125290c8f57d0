import { describe, it, expect } from 'vitest';
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';

const require = createRequire(import.meta.url);
const config = require('../../electron-builder.config.cjs') as Record<string, unknown> & {
  electronFuses: Record<string, boolean>; asarUnpack: string[]; files: string[];
  linux: { target: string[] }; win: { target: string[] }; mac: { target: string[] };
};

describe('electron-builder config', () => {
  it('sets the fuses that close the Node entry points', () => {
    // Source: Electron security checklist item 19 (check which fuses you can change) and the Electron "Fuses"
    // tutorial: runAsNode, nodeOptions, nodeCliInspect off; onlyLoadAppFromAsar and embedded asar integrity on;
    // grantFileProtocolExtraPrivileges off when file:// is not used.
    expect(config.electronFuses).toMatchObject({
      runAsNode: false,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      grantFileProtocolExtraPrivileges: false,
      onlyLoadAppFromAsar: true,
      enableEmbeddedAsarIntegrityValidation: true,
    });
  });

  it('unpacks sharp and its native packages from the asar archive', () => {
    // Source: sharp installation docs, "Electron" section (asarUnpack patterns), as quoted in the shared notes.
    expect(config.asarUnpack).toEqual(expect.arrayContaining(['**/node_modules/sharp/**/*', '**/node_modules/@img/**/*']));
  });

  it('names the app and targets each platform', () => {
    expect(config).toMatchObject({ productName: 'Eggline' });
    expect(typeof config.appId).toBe('string');
    expect(config.files).toEqual(expect.arrayContaining(['dist/**', 'package.json']));
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.win.target).toEqual(['nsis']);
    expect(config.mac.target).toEqual(['dmg']);
  });

  it('names a maintainer for the .deb package', () => {
    // Source: app-builder-lib errorMessages (authorEmailIsMissed): a .deb needs a maintainer, from the author e-mail
    // in package.json or from the linux options.
    expect((config.linux as { maintainer?: string }).maintainer).toMatch(/^[^<>]+ <[^@\s]+@[^>\s]+>$/);
  });

  it('uses only options electron-builder knows', () => {
    // Source: electron-builder's own JSON schema (node_modules/app-builder-lib/scheme.json) and FuseOptionsV1.
    const schema = JSON.parse(readFileSync(require.resolve('app-builder-lib/scheme.json'), 'utf8')) as {
      properties: Record<string, unknown>; definitions: Record<string, { properties?: Record<string, unknown> }>;
    };
    for (const key of Object.keys(config)) expect(schema.properties, key).toHaveProperty(key);
    const fuseKeys = Object.keys(schema.definitions.FuseOptionsV1?.properties ?? {});
    for (const key of Object.keys(config.electronFuses)) expect(fuseKeys, key).toContain(key);
  });
});
