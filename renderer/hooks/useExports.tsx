// Exports of the shown embryo: profile figure (SVG, PNG), annotated image (PNG), tables (CSV), all via the API.
import { renderToStaticMarkup } from 'react-dom/server';
import type { EgglineApi, ExportKind, LoadedStack } from '../../core/contract';
import { boundariesCsv, embryosCsv, landmarksCsv, profilesCsv } from '../../core/batch';
import { profileFigure } from '../../core/figures';
import type { ApAxis, ImagePoint, Plane } from '../../core/model';
import { straightViewHalfWidthPx } from '../../core/profile';
import { ImageOverlay } from '../overlay/ImageOverlay';
import { annotatedSvg } from '../export/annotatedSvg';
import { chooseScaleBar } from '../geometry';
import { fileStem, liveToResult } from '../export/liveResult';
import type { LiveMeasurement } from '../live';
import type { EditorState } from '../state';
import { effectiveFitRange } from '../state';
import { compositeRgba } from '../view';

/** The export commands offered in the toolbar. */
export type ExportCommand = 'profile-svg' | 'profile-png' | 'image-png' | 'image-png-2x' | 'embryo-csv' | 'profile-csv' | 'boundaries-csv' | 'landmarks-csv';

/** Labels of the export commands, in menu order. */
export const EXPORT_LABELS: Record<ExportCommand, string> = {
  'profile-svg': 'Profile figure (SVG)', 'profile-png': 'Profile figure (PNG)', 'image-png': 'Annotated image (PNG, full resolution)', 'image-png-2x': 'Annotated image (PNG, 2× for high-DPI)',
  'embryo-csv': 'Embryo table (CSV)', 'profile-csv': 'Profile table (CSV)', 'boundaries-csv': 'Boundaries table (CSV)', 'landmarks-csv': 'Landmarks table (CSV)',
};

interface Ctx {
  readonly state: EditorState;
  readonly stack: LoadedStack | null;
  readonly measurement: LiveMeasurement | null;
  readonly bandOutlines: readonly (readonly ImagePoint[])[];
  readonly axis: ApAxis | null;
  readonly entryName: string | null;
  readonly planes: readonly Plane[];
  readonly setMessage: (m: string | null) => void;
}

/** PNG data URL of the composite at image resolution. */
function compositeDataUrl(planes: readonly Plane[], state: EditorState): string {
  const p = planes[0];
  const c = document.createElement('canvas');
  c.width = p.width; c.height = p.height;
  c.getContext('2d')?.putImageData(new ImageData(compositeRgba(planes, state.display), p.width, p.height), 0, 0);
  return c.toDataURL('image/png');
}

/** Build an export command runner over the API. */
export function useExports(api: EgglineApi | null, ctx: Ctx): (cmd: ExportCommand) => Promise<void> {
  return async (cmd) => {
    const { state, stack, measurement: m, axis, entryName } = ctx;
    if (api === null || stack === null || m === null || axis === null || entryName === null) { ctx.setMessage('Nothing to export: open a file first'); return; }
    const stem = fileStem(entryName);
    const result = liveToResult(entryName, m, axis, stack.projected.pixelSizeUm, stack.projected.pixelSizeSource, stack.detection.eggWidthUm);
    const save = async (kind: ExportKind, name: string, content: string | Uint8Array) => {
      const r = await api.exportFile(kind, name, content);
      ctx.setMessage(r.ok ? (r.value === null ? null : `Saved ${r.value}`) : r.error.message);
    };
    const toPng = async (svg: string, scale: number, name: string) => {
      const r = await api.svgToPng(svg, scale);
      if (r.ok) await save('png', name, r.value); else ctx.setMessage(r.error.message);
    };
    const figure = () => m.profile === null ? null : profileFigure({ profile: m.profile, fit: m.fit, boundaries: m.boundaries, landmarks: m.landmarks, boundaryChannels: m.boundaryProfiles.map((b) => b.channel) },
      { showResiduals: m.fit !== null, title: `${entryName}: profile along the AP axis (${m.profile.channel})` });
    switch (cmd) {
      case 'profile-svg': case 'profile-png': {
        const svg = figure();
        if (svg === null) { ctx.setMessage(`${entryName}: no gradient profile to export`); return; }
        if (cmd === 'profile-svg') await save('svg', `${stem}-profile.svg`, svg); else await toPng(svg, 2, `${stem}-profile.png`);
        return;
      }
      case 'image-png': case 'image-png-2x': {
        const p = ctx.planes[0];
        const overlay = renderToStaticMarkup(<ImageOverlay view={{ zoom: 1, offsetX: 0, offsetY: 0 }} width={p.width} height={p.height}
          outline={stack.detection.outline} axis={axis} measurement={m} bandOutlines={ctx.bandOutlines} fitRangeEl={effectiveFitRange(state)}
          halfWidthPx={straightViewHalfWidthPx(stack.detection.eggWidthUm, stack.projected.pixelSizeUm)} selectedLandmark={null} />);
        const px = stack.projected.pixelSizeUm;
        const bar = px === null ? null : chooseScaleBar(px, 1, p.width * 0.25);
        await toPng(annotatedSvg(p.width, p.height, compositeDataUrl(ctx.planes, state), overlay, bar && { lengthUm: bar.lengthUm, lengthPx: bar.screenPx }),
          cmd === 'image-png' ? 1 : 2, cmd === 'image-png' ? `${stem}-annotated.png` : `${stem}-annotated@2x.png`);
        return;
      }
      case 'embryo-csv': await save('csv', `${stem}-embryo.csv`, embryosCsv([result])); return;
      case 'profile-csv': await save('csv', `${stem}-profiles.csv`, profilesCsv([result])); return;
      case 'boundaries-csv': await save('csv', `${stem}-boundaries.csv`, boundariesCsv([result])); return;
      case 'landmarks-csv': await save('csv', `${stem}-landmarks.csv`, landmarksCsv([result])); return;
    }
  };
}
