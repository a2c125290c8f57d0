// Overlay styles kept inside the overlay SVG, so an exported annotated image looks like the screen.

/** CSS for the image overlay (also embedded in exported SVG). */
export const OVERLAY_CSS = `
.outline{fill:none;stroke:#e8e2c8;stroke-opacity:.65;stroke-width:1.2;stroke-dasharray:5 4}
.band{fill:#5fd3e0;fill-opacity:.16;stroke:#5fd3e0;stroke-opacity:.55;stroke-width:1}
.axis-line{stroke:#ffffff;stroke-width:1.5;stroke-opacity:.85}
.axis-fit{stroke:#E69F00;stroke-width:4;stroke-opacity:.8;stroke-linecap:round}
.handle{stroke:#101317;stroke-width:1.5;cursor:grab}
.handle-anterior{fill:#ffd166}
.handle-posterior{fill:#8ab4ff}
.handle-outside{fill:none;stroke:#ff7a7a;stroke-width:2.5;stroke-dasharray:4 3}
.handle-label{font:bold 10px system-ui,sans-serif;fill:#101317;pointer-events:none}
.boundary-line{stroke-width:2;stroke-dasharray:7 4}
.landmark path{fill:#f4f6fa;stroke:#101317;stroke-width:1.2}
.landmark.selected path{fill:#ffb35c;stroke:#101317;stroke-width:1.5}
.landmark text{font:11px system-ui,sans-serif;fill:#f4f6fa;paint-order:stroke;stroke:#101317;stroke-width:3px}
`;
