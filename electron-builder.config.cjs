// Packaging for Linux (AppImage, deb), Windows (nsis) and macOS (dmg). Needs network for Electron and tool
// downloads, so it runs in a release job: `npm run dist` after `npm run build`.
/** @type {import('electron-builder').Configuration} */
module.exports = {
  appId: 'app.eggline.desktop',
  productName: 'Eggline',
  directories: { output: 'release', buildResources: 'assets' },
  // Only the built bundles and the manifest; production dependencies from node_modules are added by the builder.
  files: ['dist/**', 'package.json', '!dist/**/*.map'],
  // sharp loads native libvips binaries, which cannot be loaded from inside an asar archive.
  asarUnpack: ['**/node_modules/sharp/**/*', '**/node_modules/@img/**/*'],
  extraMetadata: { main: 'dist/main.cjs' },
  // A .deb needs a maintainer (electron-builder otherwise asks for an author e-mail in package.json). The address is
  // a placeholder in a reserved domain: set the real one in the release job.
  linux: {
    target: ['AppImage', 'deb'], category: 'Science', synopsis: 'Morphogen gradients along the AP axis of embryo images',
    maintainer: 'Eggline developers <eggline@example.org>', vendor: 'Eggline developers',
  },
  deb: { packageCategory: 'science' },
  win: { target: ['nsis'] },
  nsis: { oneClick: false, allowToChangeInstallationDirectory: true },
  mac: { target: ['dmg'], category: 'public.app-category.education' },
  electronFuses: {
    runAsNode: false,
    enableCookieEncryption: true,
    enableNodeOptionsEnvironmentVariable: false,
    enableNodeCliInspectArguments: false,
    enableEmbeddedAsarIntegrityValidation: true,
    onlyLoadAppFromAsar: true,
    grantFileProtocolExtraPrivileges: false,
  },
};
