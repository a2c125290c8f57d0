// Parameters of the synthetic embryo generator (demo data: an invented scenario, not any real specimen).
import type { ImagePoint } from '../model';

/** A sampled gradient shape: values[i] is the relative level at i·stepUm from the anterior pole. */
export interface GradientShape {
  readonly stepUm: number;
  readonly values: Float64Array;
}

/** Everything that shapes one synthetic embryo stack. Intensities are in photons unless named otherwise. */
export interface SyntheticEmbryoParams {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly sizeZ: number;
  readonly pixelSizeUm: number;
  /** Spacing of the Z slices around the mid-section, µm. */
  readonly zStepUm: number;
  readonly eggLengthUm: number;
  readonly eggWidthUm: number;
  /** Embryo centre in px; null = random, keeping the whole embryo inside the frame. */
  readonly centre: ImagePoint | null;
  /** Direction anterior→posterior in degrees (image coordinates, y down); null = random in [0, 360). */
  readonly angleDeg: number | null;
  /** Decay length of the gradient, µm. */
  readonly lambdaUm: number;
  /** Decay length right of A→P (image coordinates; ventral when dorsal is left), µm; absent or null = lambdaUm on
   *  both sides. The boundary channel and the furrow follow lambdaUm. */
  readonly rightLambdaUm?: number | null;
  /**
   * Shape of the gradient instead of exp(−x/λ): relative level sampled every stepUm from the anterior pole (linear
   * between samples, the last value beyond), e.g. one time point of a forming gradient; null = the exponential.
   */
  readonly gradientShape: GradientShape | null;
  /** Gradient amplitude at the anterior pole for dosage 1 (photons). */
  readonly gradientAmplitude: number;
  /** Dosage factor f multiplying the gradient amplitude. */
  readonly dosage: number;
  /** Uniform gradient-channel signal inside the embryo (photons), the B of A·exp(−x/λ)+B before the layer gain. */
  readonly gradientBaseline: number;
  /** Gradient level (photons, before dosage-independent factors) above which the boundary channel is on. */
  readonly boundaryThreshold: number;
  readonly boundaryAmplitude: number;
  /** Logistic width of the boundary edge, µm. */
  readonly boundaryWidthUm: number;
  /** Gradient level at which the furrow landmark forms (same rule as the boundary). */
  readonly furrowThreshold: number;
  /** Autofluorescence inside the embryo, every channel (photons). */
  readonly autofluorescence: number;
  /** Thickness of the bright nuclear layer under the surface, µm. */
  readonly nuclearLayerUm: number;
  /** Signal of the interior relative to the nuclear layer (0..1). */
  readonly interiorLevel: number;
  /** Contrast of the nuclei texture in the layer (0 = smooth). */
  readonly nucleiContrast: number;
  /** Background photons outside the embryo. */
  readonly backgroundPhotons: number;
  readonly cameraOffset: number;
  readonly readNoiseSd: number;
  /** Gaussian blur of the in-focus slice (px) and its growth per µm away from focus (px/µm). */
  readonly blurPx: number;
  readonly defocusBlurPxPerUm: number;
}

/** Defaults of the demo scenario: 512×384 px at 1.5 µm/px, 8 slices, λ = 100 µm, boundary at 0.35 EL for f = 1. */
export const DEFAULT_SYNTH_PARAMS: SyntheticEmbryoParams = Object.freeze({
  widthPx: 512,
  heightPx: 384,
  sizeZ: 8,
  pixelSizeUm: 1.5,
  zStepUm: 3,
  eggLengthUm: 500,
  eggWidthUm: 190,
  centre: null,
  angleDeg: null,
  lambdaUm: 100,
  gradientShape: null,
  gradientAmplitude: 1500,
  dosage: 1,
  gradientBaseline: 40,
  boundaryThreshold: 1500 * Math.exp(-175 / 100),
  boundaryAmplitude: 800,
  boundaryWidthUm: 6,
  furrowThreshold: 1500 * Math.exp(-150 / 100),
  autofluorescence: 25,
  nuclearLayerUm: 10,
  interiorLevel: 0.3,
  nucleiContrast: 0.3,
  backgroundPhotons: 8,
  cameraOffset: 100,
  readNoiseSd: 4,
  blurPx: 0.8,
  defocusBlurPxPerUm: 0.15,
});

/** Check generator parameters first (exact messages). */
export function checkSynthParams(p: SyntheticEmbryoParams): void {
  const positive = ['widthPx', 'heightPx', 'sizeZ', 'pixelSizeUm', 'eggLengthUm', 'eggWidthUm', 'lambdaUm', 'dosage'] as const;
  for (const k of positive) if (!(p[k] > 0) || !Number.isFinite(p[k])) throw new Error(`${k} must be a positive number, got ${p[k]}`);
  for (const k of ['widthPx', 'heightPx', 'sizeZ'] as const) {
    if (!Number.isInteger(p[k])) throw new Error(`${k} must be an integer, got ${p[k]}`);
  }
  const right = p.rightLambdaUm;
  if (right !== undefined && right !== null && !(right > 0 && Number.isFinite(right))) throw new Error(`rightLambdaUm must be a positive number or null, got ${right}`);
  const shape = p.gradientShape;
  if (shape && !(shape.stepUm > 0 && shape.values.length >= 2 && shape.values.every(Number.isFinite))) {
    throw new Error('gradientShape must have stepUm > 0 and at least 2 finite values');
  }
  if (p.eggWidthUm > p.eggLengthUm) throw new Error(`eggWidthUm (${p.eggWidthUm}) must not exceed eggLengthUm (${p.eggLengthUm})`);
}
