// An SVG document of the image with its overlays at image resolution (for the annotated PNG export).

/** A scale bar for the exported image: length in µm and in image px. */
export interface ExportScaleBar { readonly lengthUm: number; readonly lengthPx: number }

/** Scale bar markup: white bar with its length, bottom-left, 12 px from the edges. */
function scaleBarSvg(heightPx: number, bar: ExportScaleBar): string {
  const y = heightPx - 12;
  return `<g class="scale-bar"><rect x="12" y="${y - 4}" width="${bar.lengthPx.toFixed(1)}" height="4" fill="#ffffff"/>`
    + `<text x="12" y="${y - 8}" font-family="system-ui,sans-serif" font-size="12" fill="#ffffff">${bar.lengthUm} µm</text></g>`;
}

/** Wrap a PNG data URL of the image and overlay markup (already in image pixel units) into one SVG document. */
export function annotatedSvg(widthPx: number, heightPx: number, pngDataUrl: string, overlayInner: string, bar: ExportScaleBar | null = null): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}">`
    + `<image x="0" y="0" width="${widthPx}" height="${heightPx}" href="${pngDataUrl}" xlink:href="${pngDataUrl}" style="image-rendering:pixelated"/>`
    + `${overlayInner}${bar === null ? '' : scaleBarSvg(heightPx, bar)}</svg>`;
}
