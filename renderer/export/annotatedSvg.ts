// An SVG document of the image with its overlays at image resolution (for the annotated PNG export).

/** Wrap a PNG data URL of the image and overlay markup (already in image pixel units) into one SVG document. */
export function annotatedSvg(widthPx: number, heightPx: number, pngDataUrl: string, overlayInner: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}">`
    + `<image x="0" y="0" width="${widthPx}" height="${heightPx}" href="${pngDataUrl}" xlink:href="${pngDataUrl}" style="image-rendering:pixelated"/>`
    + `${overlayInner}</svg>`;
}
