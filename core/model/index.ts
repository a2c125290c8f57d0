// Shared data types that flow through the pipeline (cohort types in ./cohort.ts).
// Coordinate convention everywhere: x = column, y = row, 0-based, pixel centres at integers.
// Positions along the AP axis: x/EL in [0, 1], 0 = anterior pole, 1 = posterior pole.

/** A point in image pixel coordinates (x = column, y = row, centre of the first pixel at 0,0). */
export interface ImagePoint {
  readonly x: number;
  readonly y: number;
}

/** Pixel storage that a decoder may return, by sample type. */
export type PixelArray =
  | Uint8Array
  | Int8Array
  | Uint16Array
  | Int16Array
  | Uint32Array
  | Int32Array
  | Float32Array
  | Float64Array;

/** Sample types Eggline reads (TIFF SampleFormat × BitsPerSample, or OME Pixels@Type). */
export type SampleType = 'uint8' | 'int8' | 'uint16' | 'int16' | 'uint32' | 'int32' | 'float32' | 'float64';

/** One decoded 2-D plane, row-major; data.length === width * height. */
export interface RawPlane {
  readonly width: number;
  readonly height: number;
  readonly data: PixelArray;
}

/** A 2-D float image used by every analysis step (row-major, data.length === width * height). */
export interface Plane {
  readonly width: number;
  readonly height: number;
  readonly data: Float32Array;
}

/** A binary image: 1 inside, 0 outside (row-major). */
export interface Mask {
  readonly width: number;
  readonly height: number;
  readonly data: Uint8Array;
}

/** Where a pixel size came from; always reported next to the value. */
export type PixelSizeSource = 'ome' | 'ome-zarr' | 'tiff-resolution' | 'user' | 'unknown';

/** Pixel size in micrometres per pixel, with its provenance. */
export interface PixelSize {
  readonly xUm: number | null;
  readonly yUm: number | null;
  readonly zUm: number | null;
  readonly source: PixelSizeSource;
}

/** Where the time of each time point came from; always reported next to the values. */
export type TimeSource = 'ome-plane' | 'ome-increment' | 'ome-zarr' | 'imagej' | 'user' | 'unknown';

/** Time of each time point in seconds from the first, with its provenance; timesS is null when unknown. */
export interface TimeAxis {
  readonly timesS: Float64Array | null;
  readonly source: TimeSource;
}

/** The six OME DimensionOrder values. */
export type DimensionOrder = 'XYZCT' | 'XYZTC' | 'XYCTZ' | 'XYCZT' | 'XYTCZ' | 'XYTZC';

/** What the tag reader learns about a file without decoding pixels. */
export interface StackInfo {
  readonly byteOrder: 'II' | 'MM';
  readonly bigTiff: boolean;
  readonly isOme: boolean;
  readonly sizeX: number;
  readonly sizeY: number;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  readonly dimensionOrder: DimensionOrder;
  readonly sampleType: SampleType;
  readonly samplesPerPixel: number;
  readonly channelNames: readonly string[];
  readonly pixelSize: PixelSize;
  /** Human-readable compression of the first plane, e.g. "LZW + horizontal predictor". */
  readonly compression: string;
  /** TIFF Compression code of the first plane (TIFF 6.0 §3; 34925 LZMA, 50000 Zstandard); absent for other formats. */
  readonly compressionCode?: number;
  /** IFD index of plane (z, c, t): planeIfd[(t * sizeC + c) * sizeZ + z]. */
  readonly planeIfd: Int32Array;
  /** Number of IFDs in the main chain. */
  readonly ifdCount: number;
  /** Raw ImageDescription of IFD 0 (OME-XML or other text), or null. */
  readonly description: string | null;
  readonly warnings: readonly string[];
  /** Time of each time point (length sizeT) when the file says; absent or timesS null = unknown. */
  readonly time?: TimeAxis;
}

/** Z projection methods. 'slice' takes one chosen plane. */
export type ProjectionMethod = 'max' | 'mean' | 'sum' | 'slice';

/** The AP axis in image coordinates, with how it was set. */
export interface ApAxis {
  readonly anterior: ImagePoint;
  readonly posterior: ImagePoint;
  /** 'auto' = found by the core; 'hand' = set or corrected by the user. */
  readonly source: 'auto' | 'hand';
}

/** A binned profile along the AP axis. All arrays have one entry per bin. */
export interface Profile {
  readonly channel: string;
  /** Bin centres in x/EL (0 = anterior pole). */
  readonly xEl: Float64Array;
  /** Bin centres in µm from the anterior pole. */
  readonly xUm: Float64Array;
  /** Mean intensity per bin after background subtraction. */
  readonly mean: Float64Array;
  /** Standard deviation of the pixels in each bin. */
  readonly sd: Float64Array;
  /** Number of pixels in each bin. */
  readonly n: Float64Array;
}

/** A fitted exponential gradient A·exp(−x/λ) + B over a range of x/EL. */
export interface ExponentialFit {
  readonly amplitude: number;
  readonly amplitudeSe: number;
  readonly lambdaUm: number;
  readonly lambdaSeUm: number;
  readonly lambdaCiLowUm: number;
  readonly lambdaCiHighUm: number;
  readonly lambdaEl: number;
  readonly lambdaSeEl: number;
  /** Model-based SE of λ (µm): s²·(JᵀWJ)⁻¹ with s² from the residuals, errors independent between bins. */
  readonly lambdaSeModelUm: number;
  /** SE of λ (µm) allowing first-order autoregressive correlation of the residuals along x; NaN if not computable. */
  readonly lambdaSeSerialUm: number;
  /** Which of the two gave lambdaSeUm and the interval (the wider). */
  readonly lambdaSeSource: 'model' | 'serial';
  /** Lag-1 correlation of the (weighted) residuals along x. */
  readonly residualLag1: number;
  /** Whether bins were weighted by their inverse variance (n/SD²). */
  readonly weighted: boolean;
  readonly background: number;
  readonly backgroundSe: number;
  readonly r2: number;
  readonly rss: number;
  readonly dof: number;
  readonly iterations: number;
  readonly fitRangeEl: readonly [number, number];
  /** x/EL of each point used in the fit, and its residual (data − model). */
  readonly xEl: Float64Array;
  readonly residuals: Float64Array;
  /**
   * Each side's own fit with --edge-side each only: the depth term (EL), in lambdaSe* and the interval: half the
   * change of λ when only the outer half of the band is sampled, added in quadrature (an error smooth along the side
   * that no residual sees; see the README's methods). Absent elsewhere.
   */
  readonly depthTermEl?: number;
}

/**
 * The paired difference of the decay lengths of one embryo's two sides, λ_dorsal − λ_ventral. Its standard error
 * allows for errors that are correlated between the two sides at the same position (shared axis, staining and
 * blur): the covariance of the two fits comes from their sandwich with the sides' cross-covariance estimated from
 * the residuals at shared positions (see README, "Both sides measured").
 */
export interface DecayLengthDifference {
  /** λ_dorsal − λ_ventral in µm (NaN when the pixel size is unknown) and as a fraction of egg length. */
  readonly lambdaUm: number;
  readonly lambdaEl: number;
  readonly seUm: number;
  readonly seEl: number;
  /** 95% t interval (µm: NaN without a pixel size). */
  readonly ciLowUm: number;
  readonly ciHighUm: number;
  readonly ciLowEl: number;
  readonly ciHighEl: number;
  /** SE (EL) with errors independent between bins, and allowing first-order autoregressive errors (NaN if not computable). */
  readonly seModelEl: number;
  readonly seSerialEl: number;
  /** Which of the two gave seEl and the interval (the wider). */
  readonly seSource: 'model' | 'serial';
  /** Estimated correlation of the two sides' errors at the same position (of the estimate that was used). */
  readonly sideCorrelation: number;
  /** Degrees of freedom of the t quantile (the smaller side's). */
  readonly dof: number;
  /**
   * The depth term (EL), in seE and the interval when present: half the change of the difference when only the outer
   * half of the band is sampled, added in quadrature to the SE of seSource (an error smooth along each side that no
   * residual sees; see the README's methods). Absent when it was not computed.
   */
  readonly depthTermEl?: number;
}

/** Each side of the edge band profiled and fitted on its own, and the paired difference of their decay lengths. */
export interface SidesMeasurement {
  readonly dorsalProfile: Profile;
  readonly ventralProfile: Profile;
  /** null when that side's fit failed (the warnings say why). */
  readonly dorsalFit: ExponentialFit | null;
  readonly ventralFit: ExponentialFit | null;
  /** null when either fit failed or the difference's SE could not be computed. */
  readonly difference: DecayLengthDifference | null;
}

/** Boundary-finding methods. */
export type BoundaryMethod = 'logistic' | 'half-max' | 'threshold';

/** One boundary found in one channel by one method. */
export interface Boundary {
  readonly channel: string;
  readonly method: BoundaryMethod;
  /** Position in x/EL (null when the method found none). */
  readonly positionEl: number | null;
  readonly positionUm: number | null;
  /** Logistic width (x/EL) for 'logistic', null otherwise. */
  readonly widthEl: number | null;
  /** Standard error of the position in x/EL where the method gives one. */
  readonly positionSeEl: number | null;
  /** 'falling' when expression is high anterior of the boundary. */
  readonly direction: 'rising' | 'falling' | null;
  readonly note: string | null;
}

/** A hand-placed landmark and its projection onto the AP axis. */
export interface Landmark {
  readonly name: string;
  readonly point: ImagePoint;
}

/** A landmark projected onto the AP axis. */
export interface LandmarkPosition {
  readonly name: string;
  readonly point: ImagePoint;
  readonly xEl: number;
  readonly xUm: number;
  /** Signed distance from the axis line in µm (positive to the left of anterior→posterior). */
  readonly offAxisUm: number;
}

/** Background estimate subtracted from one channel. */
export interface BackgroundEstimate {
  readonly channel: string;
  readonly method: 'outside' | 'region' | 'none';
  /** Value subtracted (intensity units of the projected image). */
  readonly value: number;
}

/** Hand corrections kept per file in the project; the batch uses them when present. */
export interface HandEdits {
  readonly axis: ApAxis | null;
  readonly landmarks: readonly Landmark[];
}

/** Everything measured for one embryo at one time point; (file, tIndex) is its key (see resultKey). */
export interface EmbryoResult {
  /** Path relative to the input folder (or the file name). */
  readonly file: string;
  /** Time point analysed (0-based); absent means 0, as for a file with one time point. */
  readonly tIndex?: number;
  /** Time of that time point in seconds from the movie's first, when the file (or --time-step) says; absent or null: unknown. */
  readonly tS?: number | null;
  readonly status: 'ok' | 'error';
  readonly error: string | null;
  readonly warnings: readonly string[];
  readonly pixelSizeUm: number | null;
  readonly pixelSizeSource: PixelSizeSource;
  readonly eggLengthUm: number | null;
  readonly eggWidthUm: number | null;
  readonly axis: ApAxis | null;
  readonly gradientChannel: string | null;
  readonly gradientProfile: Profile | null;
  readonly gradientFit: ExponentialFit | null;
  readonly boundaryProfiles: readonly Profile[];
  readonly boundaries: readonly Boundary[];
  readonly landmarks: readonly LandmarkPosition[];
  readonly backgrounds: readonly BackgroundEstimate[];
  /** Each side measured on its own with the paired difference (edge band, --edge-side each); absent otherwise. */
  readonly sides?: SidesMeasurement;
}

/**
 * A file analysed per time point (a movie): which time points, their times, and the options of its time summary, so
 * that the summary (λ(t), τ(x), the model fit) can be made again from the results alone (merge, the window). `error`
 * says why the movie could not be analysed over time (then timeIndices is empty).
 */
export interface MovieRecord {
  readonly file: string;
  /** Analysed time points, 0-based, ascending; each has a result keyed (file, t). */
  readonly timeIndices: readonly number[];
  /** Time of each analysed time point in s on the movie's clock (same length), or null when unknown. */
  readonly timesS: Float64Array | null;
  /** Where the times came from (TimeSource: ome-plane, ome-increment, imagej, ome-zarr, user), or null when unknown. */
  readonly timeSource?: string | null;
  /** x/EL range of the per-time-point exponential fits (the file's own, when the project sets one). */
  readonly fitRangeEl: readonly [number, number];
  /** x/EL range of the τ(x) model fit (--tau-range). */
  readonly modelRangeEl: readonly [number, number];
  /** Frames before production whose mean is the zero (--baseline-frames). */
  readonly baselineFrames: number;
  /** Warnings about the movie's time axis (e.g. where its times came from). */
  readonly warnings: readonly string[];
  readonly error: string | null;
}

/** Reads decoded planes of one stack; implemented by the sharp decoder (app/) and the geotiff decoder (core/tiff). */
export interface PlaneSource {
  /**
   * Decode plane (z, c, t), all 0-based. Rejects with a clear message on bad data. `into`, when given, is an array
   * of the stack's sample type holding sizeX·sizeY values that the source may decode into instead of a new array
   * (then the returned data is `into`; a source that cannot, or a plane of another type or size, returns a new array
   * and leaves `into` as it was or partly written). The caller lends `into` until the promise settles: a reader of
   * many planes (a movie's time points) reuses one array per plane it holds, so no plane costs a fresh allocation.
   */
  readPlane(z: number, c: number, t: number, into?: PixelArray): Promise<RawPlane>;
  /** Release file handles. */
  close(): Promise<void>;
}

/** A stack projected over Z: one float plane per channel, plus calibration. */
export interface ProjectedStack {
  readonly channels: readonly Plane[];
  readonly channelNames: readonly string[];
  /** µm per pixel (x; y assumed equal unless the file says otherwise, then warned). */
  readonly pixelSizeUm: number | null;
  readonly pixelSizeSource: PixelSizeSource;
  readonly projection: ProjectionMethod;
  /** The slice used when projection is 'slice' (0-based), else null. */
  readonly sliceIndex: number | null;
  readonly warnings: readonly string[];
  /**
   * Per channel, the one decoded plane whose values each channel holds exactly (8/16-bit samples, one plane per
   * channel, no correction applied), when the projection was asked to keep them (projectStack's `planes`: a movie);
   * else absent. The background counts these samples instead of the floats. Anything that changes the channels'
   * values drops it.
   */
  readonly rawPlanes?: readonly RawPlane[];
}

/** What segmentation and axis finding produce for one embryo. */
export interface Detection {
  readonly mask: Mask;
  /** Outline of the mask as a closed polygon in image coordinates. */
  readonly outline: readonly ImagePoint[];
  readonly axis: ApAxis;
  readonly eggLengthUm: number;
  readonly eggWidthUm: number;
  readonly warnings: readonly string[];
}

export { errorResult, oneLine } from './error-result';
export { resultKey, resultKeyOf, resultTimeIndex, parseResultKey, withTimePoint, embryoResults, type ResultKey } from './result-key';
export type * from './cohort';
export { NO_BACKGROUND_CONDITION } from './cohort';
