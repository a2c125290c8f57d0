// Exports of the time-lapse view through the API's save dialog: each figure as SVG or PNG (PNG rendered by the app
// at 2×), the image at the shown time point as PNG (as shown, with axis and landmarks), and the batch's six time
// tables for this movie as CSV.
import type { EgglineApi, ExportKind, MovieView } from '../../../core/contract';
import { fileStem } from '../../export/liveResult';
import { movieDisplay, paintFrame } from './FrameImage';
import { kymographAt, lambdaAt, profileAt, tauFigure } from './movieFigures';

/** The export commands of the time-lapse view. */
export type MovieExportCommand =
  | 'profile-svg' | 'profile-png' | 'kymograph-svg' | 'kymograph-png' | 'lambda-svg' | 'lambda-png' | 'tau-svg' | 'tau-png'
  | 'image-png' | 'timecourse-csv' | 'profiles-csv' | 'boundaries-csv' | 'landmarks-csv' | 'accumulation-csv' | 'model-fit-csv';

/** Menu labels in menu order. */
export const MOVIE_EXPORT_LABELS: Record<MovieExportCommand, string> = {
  'profile-svg': 'Profile at this time point (SVG)', 'profile-png': 'Profile at this time point (PNG)',
  'kymograph-svg': 'Kymograph (SVG)', 'kymograph-png': 'Kymograph (PNG)',
  'lambda-svg': 'λ over time (SVG)', 'lambda-png': 'λ over time (PNG)',
  'tau-svg': 'τ(x) with the model (SVG)', 'tau-png': 'τ(x) with the model (PNG)',
  'image-png': 'Image at this time point (PNG, at the size shown)',
  'timecourse-csv': 'Time course table (CSV)', 'profiles-csv': 'Profiles over time (CSV)', 'boundaries-csv': 'Boundaries over time (CSV)', 'landmarks-csv': 'Landmarks over time (CSV)',
  'accumulation-csv': 'Accumulation time τ(x) (CSV)', 'model-fit-csv': 'Model fit: k, D, λ_τ (CSV)',
};

/** Size of exported figures, px (PNG at 2×). */
export const MOVIE_FIGURE_BOX = { widthPx: 800, heightPx: 500 } as const;

/** The file name and content of a figure or table export; null (with the reason) when there is nothing to export. */
export function movieExportContent(view: MovieView, k: number, cmd: Exclude<MovieExportCommand, 'image-png'>): { name: string; kind: 'svg' | 'csv'; text: string } | { none: string } {
  const stem = fileStem(view.file);
  const t = `t${view.timeIndices[k]}`;
  const figure = (name: string, svg: string | null) => (svg === null ? { none: `${view.file}: no ${name} for this movie${view.note ? ` (${view.note})` : ''}` } : { name, kind: 'svg' as const, text: svg });
  switch (cmd) {
    case 'profile-svg': case 'profile-png': return withName(figure('profile', profileAt(view, k, MOVIE_FIGURE_BOX, `${view.file}: profile at time point ${view.timeIndices[k] + 1}`)), `${stem}-${t}-profile.svg`);
    case 'kymograph-svg': case 'kymograph-png': return withName(figure('kymograph', kymographAt(view, k, MOVIE_FIGURE_BOX)), `${stem}-kymograph.svg`);
    case 'lambda-svg': case 'lambda-png': return withName(figure('λ over time', lambdaAt(view, k, MOVIE_FIGURE_BOX)), `${stem}-lambda.svg`);
    case 'tau-svg': case 'tau-png': return withName(figure('τ(x)', tauFigure(view, MOVIE_FIGURE_BOX)), `${stem}-tau.svg`);
    case 'timecourse-csv': return { name: `${stem}-timecourse.csv`, kind: 'csv', text: view.tables.timecourse };
    case 'profiles-csv': return { name: `${stem}-timecourse_profiles.csv`, kind: 'csv', text: view.tables.profiles };
    case 'boundaries-csv': return { name: `${stem}-timecourse_boundaries.csv`, kind: 'csv', text: view.tables.boundaries };
    case 'landmarks-csv': return { name: `${stem}-timecourse_landmarks.csv`, kind: 'csv', text: view.tables.landmarks };
    case 'accumulation-csv': return { name: `${stem}-accumulation.csv`, kind: 'csv', text: view.tables.accumulation };
    case 'model-fit-csv': return { name: `${stem}-model_fit.csv`, kind: 'csv', text: view.tables.modelFit };
  }
}

function withName<T extends { name: string } | { none: string }>(r: T, name: string): T {
  return 'none' in r ? r : { ...r, name };
}

/** Run one export: a save dialog, then write; the outcome goes to the message bar. */
export async function movieExport(api: EgglineApi, view: MovieView, k: number, cmd: MovieExportCommand, setMessage: (m: string | null) => void): Promise<void> {
  if (cmd === 'image-png') {
    const canvas = document.createElement('canvas');
    if (!paintFrame(canvas, view, k, movieDisplay(view))) { setMessage(`${view.file}: no image at time point ${view.timeIndices[k] + 1}`); return; }
    const bytes = Uint8Array.from(atob(canvas.toDataURL('image/png').split(',')[1]), (ch) => ch.charCodeAt(0));
    const r = await api.exportFile('png', `${fileStem(view.file)}-t${view.timeIndices[k]}-image.png`, bytes);
    setMessage(r.ok ? (r.value === null ? null : `Saved ${r.value}`) : r.error.message);
    return;
  }
  const c = movieExportContent(view, k, cmd);
  if ('none' in c) { setMessage(c.none); return; }
  const save = async (kind: ExportKind, name: string, content: string | Uint8Array) => {
    const r = await api.exportFile(kind, name, content);
    setMessage(r.ok ? (r.value === null ? null : `Saved ${r.value}`) : r.error.message);
  };
  if (!cmd.endsWith('-png')) { await save(c.kind, c.name, c.text); return; }
  const png = await api.svgToPng(c.text, 2);
  if (png.ok) await save('png', c.name.replace(/\.svg$/, '.png'), png.value); else setMessage(png.error.message);
}
