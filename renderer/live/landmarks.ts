// Landmark positions along the AP axis.
import type { ApAxis, Landmark, LandmarkPosition } from '../../core/model';
import { axisFraction, axisLeftNormal, distancePx } from '../geometry';

/** Project landmarks onto the axis: x/EL, µm from the anterior pole, signed µm off the axis (positive = left of A→P). */
export function landmarkPositions(landmarks: readonly Landmark[], axis: ApAxis, pixelSizeUm: number): LandmarkPosition[] {
  const n = axisLeftNormal(axis.anterior, axis.posterior);
  const lengthUm = distancePx(axis.anterior, axis.posterior) * pixelSizeUm;
  return landmarks.map((l) => {
    const xEl = axisFraction(axis.anterior, axis.posterior, l.point);
    const off = (l.point.x - axis.anterior.x) * n.x + (l.point.y - axis.anterior.y) * n.y;
    return { name: l.name, point: l.point, xEl, xUm: xEl * lengthUm, offAxisUm: off * pixelSizeUm };
  });
}
