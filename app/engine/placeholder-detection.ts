// When automatic detection finds no embryo, the stack is still shown with a placeholder axis so the user can set
// the axis by hand instead of losing the file.
import type { Detection, ProjectedStack } from '../../core/model';

/**
 * A detection covering the whole frame, with a horizontal axis through the middle from 10% to 90% of the width
 * (x = column, y = row, pixel centres at integers), and a warning naming the file and why detection failed.
 */
export function placeholderDetection(projected: ProjectedStack, label: string, reason: string): Detection {
  const first = projected.channels[0];
  const width = first?.width ?? 1;
  const height = first?.height ?? 1;
  const y = (height - 1) / 2;
  const anterior = { x: 0.1 * (width - 1), y };
  const posterior = { x: 0.9 * (width - 1), y };
  const um = projected.pixelSizeUm ?? Number.NaN;
  return {
    mask: { width, height, data: new Uint8Array(width * height).fill(1) },
    outline: [{ x: -0.5, y: -0.5 }, { x: width - 0.5, y: -0.5 }, { x: width - 0.5, y: height - 0.5 }, { x: -0.5, y: height - 0.5 }],
    axis: { anterior, posterior, source: 'auto' },
    eggLengthUm: (posterior.x - anterior.x) * um,
    eggWidthUm: height * um,
    warnings: [`${label}: no embryo found automatically (${reason}); the axis shown is a placeholder, set it by hand`],
  };
}
