// Public surface of core/geometry: axis of a mask, poles, outline, positions along the AP axis, straightening,
// and embryo detection. Coordinates: x = column, y = row (y down), 0-based, pixel centres at integers.
export { axisFraction, axisFrame, axisLeftNormal, axisLengthPx, distancePx, pointOnAxis, projectPointOntoAxis } from './axis-math';
export type { AxisPosition } from './axis-math';
export { principalAxis } from './principal-axis';
export type { PrincipalAxis } from './principal-axis';
export { polesFromOutline } from './poles';
export type { PoleExtent } from './poles';
export { maskContours, maskOutline } from './outline';
export { straightenPlane } from './straighten';
export { endMeans, chooseAnterior } from './orientation';
export { detectEmbryo } from './detect';
export type { EmbryoDetection } from './detect';
export { distanceOutsideMaskPx } from './outside';
