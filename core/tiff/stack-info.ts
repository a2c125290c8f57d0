// readStackInfo: everything about a stack that the tags say, without decoding pixels.
import type { DimensionOrder, PixelSize, SampleType, StackInfo } from '../model';
import type { ByteSource } from './byte-source';
import { describeCompression, isBilevelCompression, unsupportedCompression } from './compression';
import { sequentialPlaneMap, mapOmePlanes } from './plane-map';
import { TiffError } from './errors';
import { readTiffHeader, type TiffHeader } from './header';
import { readIfdChain, type Ifd } from './ifd';
import { parseImageJDescription } from './imagej';
import { parseShapeDescription } from './shape-description';
import { readImageLayout, type ImageLayout } from './layout';
import { looksLikeOmeXml, parseOmeXml, type OmeImage } from './ome';
import { micrometresPerPixel } from './resolution';
import { sampleTypeOf } from './sample-type';
import { readNumber, readTag } from './tag-value';
import { Tag } from './tags';
import { checkPlaneBudget } from './budget';
import { cachedByteSource } from './block-cache';
import { colourModelOf } from './photometric';
import { omeTimeAxis, imagejTimeAxis } from './time-axis';

/** Options for readStackInfo. */
export interface StackInfoOptions {
  /** Largest decoded plane (bytes) the caller will accept; default 1 GiB. */
  readonly maxPlaneBytes?: number;
}

/** A file's header and main IFD chain, as readStackInfo read them (a plane source can start from these). */
export interface TiffChain {
  readonly header: TiffHeader;
  readonly ifds: readonly Ifd[];
}

/** Reads tags (OME-XML, ImageJ description or plain TIFF) into a StackInfo; throws TiffError with a one-line message. */
export async function readStackInfo(file: ByteSource, fileLabel: string, options: StackInfoOptions = {}): Promise<StackInfo> {
  return (await readStackInfoWithChain(file, fileLabel, options)).info;
}

/**
 * readStackInfo, also returning the header and IFD chain it read, so a plane source need not walk the chain again
 * (a file of 65,535 planes spent as long on the second walk as on the first).
 */
export async function readStackInfoWithChain(file: ByteSource, fileLabel: string, options: StackInfoOptions = {}): Promise<{ info: StackInfo; chain: TiffChain }> {
  const maxPlaneBytes = options.maxPlaneBytes ?? 2 ** 30;
  if (!(maxPlaneBytes > 0)) throw new Error('maxPlaneBytes must be a positive number');
  const source = cachedByteSource(file);
  const header = await readTiffHeader(source, fileLabel);
  const ifds = await readIfdChain(source, header, fileLabel);
  const layout = await readImageLayout(source, header, ifds[0], fileLabel);
  if (isBilevelCompression(layout.compression)) throw new TiffError('unsupported', fileLabel, '1-bit (bilevel) images are not supported');
  const sampleType = sampleTypeOf(layout, fileLabel);
  const compressionProblem = unsupportedCompression(layout.compression);
  if (compressionProblem !== null) throw new TiffError('unsupported', fileLabel, compressionProblem);
  const colour = colourModelOf(layout.photometric);
  if (colour !== null) {
    throw new TiffError('unsupported', fileLabel, `${colour} images are not supported for analysis (export the raw grey-level channels)`);
  }
  checkPlaneBudget(layout, sampleType, source.size, maxPlaneBytes, fileLabel);
  const descriptionTag = await readTag(source, header, ifds[0], Tag.ImageDescription, fileLabel);
  const description = descriptionTag?.kind === 'ascii' ? descriptionTag.text : null;
  const base = { header, ifds, layout, sampleType, description };
  const stack = description !== null && looksLikeOmeXml(description)
    ? await omeStack(source, base, parseOmeXml(description, fileLabel), fileLabel)
    : await plainStack(source, base, fileLabel);
  await checkPlaneSizes(source, header, ifds, stack.planeIfd, layout, fileLabel, stack.isOme);
  return { info: stack, chain: { header, ifds } };
}

/** What both the OME and the plain path start from. */
interface BaseInfo {
  readonly header: TiffHeader;
  readonly ifds: readonly Ifd[];
  readonly layout: ImageLayout;
  readonly sampleType: SampleType;
  readonly description: string | null;
}

/** Pixel size from resolution tags, or unknown. */
function resolutionPixelSize(layout: ImageLayout, zUm: number | null = null): PixelSize {
  const xUm = micrometresPerPixel(layout.xResolution, layout.resolutionUnit);
  const yUm = micrometresPerPixel(layout.yResolution, layout.resolutionUnit);
  if (xUm === null) return { xUm: null, yUm: null, zUm, source: 'unknown' };
  return { xUm, yUm: yUm ?? xUm, zUm, source: 'tiff-resolution' };
}

/** The StackInfo fields common to every path. */
function common(base: BaseInfo) {
  return {
    byteOrder: base.header.littleEndian ? 'II' as const : 'MM' as const,
    bigTiff: base.header.bigTiff,
    sizeX: base.layout.widthPx,
    sizeY: base.layout.heightPx,
    sampleType: base.sampleType,
    samplesPerPixel: base.layout.samplesPerPixel,
    compression: describeCompression(base.layout.compression, base.layout.predictor),
    compressionCode: base.layout.compression,
    ifdCount: base.ifds.length,
    description: base.description,
  };
}

/** OME-TIFF: sizes, order, channel names and physical sizes from the XML; TIFF values win on disagreement. */
async function omeStack(_source: ByteSource, base: BaseInfo, ome: OmeImage, fileLabel: string): Promise<StackInfo> {
  const warnings = [...ome.warnings];
  const spp = base.layout.samplesPerPixel;
  if (spp > 1 && ome.sizeC !== spp) {
    throw new TiffError('unsupported', fileLabel, `OME-TIFF with ${spp} samples per pixel and ${ome.sizeC} channels is not supported (only one channel per sample)`);
  }
  if (ome.sizeX !== base.layout.widthPx || ome.sizeY !== base.layout.heightPx) {
    warnings.push(`OME size ${ome.sizeX}×${ome.sizeY} differs from the TIFF size ${base.layout.widthPx}×${base.layout.heightPx}; using the TIFF size`);
  }
  const omeType = ome.type === 'float' ? 'float32' : ome.type === 'double' ? 'float64' : ome.type;
  if (omeType !== base.sampleType) warnings.push(`OME Type "${ome.type}" differs from the TIFF sample type ${base.sampleType}; using the TIFF type`);
  const counts = { sizeZ: ome.sizeZ, sizeC: ome.sizeC, sizeT: ome.sizeT };
  // Several samples per pixel that are not colour (colour was refused above): each sample is one channel, and the
  // OME planes count the IFDs with one channel.
  const planeIfd = spp > 1
    ? expandSamplesZt(mapOmePlanes(ome.dimensionOrder, { ...counts, sizeC: 1 }, ome.tiffData, base.ifds.length, fileLabel), spp, ome.sizeZ, ome.sizeT)
    : mapOmePlanes(ome.dimensionOrder, counts, ome.tiffData, base.ifds.length, fileLabel);
  if (spp > 1) warnings.push(`${spp} samples per pixel read as ${spp} channels`);
  const pixelSize: PixelSize = ome.physicalSizeXUm !== null
    ? { xUm: ome.physicalSizeXUm, yUm: ome.physicalSizeYUm ?? ome.physicalSizeXUm, zUm: ome.physicalSizeZUm, source: 'ome' }
    : resolutionPixelSize(base.layout, ome.physicalSizeZUm);
  if (pixelSize.source === 'unknown') warnings.push('pixel size unknown (no OME PhysicalSizeX and no usable resolution tags)');
  const channelNames = Array.from({ length: ome.sizeC }, (_, c) => ome.channelNames[c] || `C${c}`);
  const time = omeTimeAxis(ome, warnings);
  return { ...common(base), isOme: true, ...counts, dimensionOrder: ome.dimensionOrder, channelNames, pixelSize, planeIfd, warnings, time };
}

/** Plain TIFF: full-resolution IFDs as Z (or ImageJ channels/slices/frames); samples per pixel become channels. */
async function plainStack(source: ByteSource, base: BaseInfo, fileLabel: string): Promise<StackInfo> {
  const warnings: string[] = [];
  // WhiteIsZero (TIFF 6.0 §3) flips the meaning of values; analysis keeps them as stored, so say so.
  if (base.layout.photometric === 0) warnings.push('image is WhiteIsZero: values are used as stored (high = dark)');
  const planes = await fullResolutionIfds(source, base, fileLabel);
  if (planes.length < base.ifds.length) warnings.push(`${base.ifds.length - planes.length} IFDs of another size or reduced resolution ignored`);
  const imagej = base.description !== null ? parseImageJDescription(base.description) : null;
  const spp = base.layout.samplesPerPixel;
  let counts = { sizeZ: planes.length, sizeC: 1, sizeT: 1 };
  let order: DimensionOrder = 'XYZCT';
  const shape = base.description !== null && imagej === null
    ? parseShapeDescription(base.description, base.layout.widthPx, base.layout.heightPx, spp, planes.length)
    : null;
  if (spp > 1) {
    warnings.push(`${spp} samples per pixel read as ${spp} channels`);
    counts = { sizeZ: planes.length, sizeC: spp, sizeT: 1 };
    if (shape && shape.sizeC === 1 && shape.sizeT === 1) counts = { sizeZ: shape.sizeZ, sizeC: spp, sizeT: 1 };
  } else if (shape && (shape.sizeC > 1 || shape.sizeT > 1)) {
    counts = { sizeZ: shape.sizeZ, sizeC: shape.sizeC, sizeT: shape.sizeT };
    order = 'XYCZT'; // row-major [T, Z, C] pages: channel fastest
    warnings.push(`tifffile shape [${shape.shape.join(', ')}] read as ${shape.sizeT > 1 ? 'T × ' : ''}Z × C × Y × X (the file names no axes)`);
  } else if (imagej && (imagej.channels ?? 1) * (imagej.slices ?? 1) * (imagej.frames ?? 1) === planes.length) {
    counts = { sizeZ: imagej.slices ?? 1, sizeC: imagej.channels ?? 1, sizeT: imagej.frames ?? 1 };
    order = 'XYCZT'; // ImageJ hyperstacks store channel fastest, then slice, then frame
  } else if (imagej && imagej.images !== null && imagej.images !== planes.length) {
    warnings.push(`ImageJ description declares ${imagej.images} images but the file has ${planes.length} IFDs; reading the IFDs as Z`);
  }
  const planeIfd = spp > 1 ? expandSamples(planes, spp) : sequentialPlaneMap(order, counts, planes);
  let pixelSize = resolutionPixelSize(base.layout, imagej?.spacingUm ?? null);
  if (pixelSize.source === 'unknown' && imagej?.unitUm != null && base.layout.xResolution !== null) {
    const xUm = imagej.unitUm / base.layout.xResolution;
    pixelSize = { xUm, yUm: base.layout.yResolution !== null ? imagej.unitUm / base.layout.yResolution : xUm, zUm: imagej.spacingUm, source: 'tiff-resolution' };
  }
  if (pixelSize.source === 'unknown') warnings.push('pixel size unknown (no usable resolution tags)');
  const channelNames = Array.from({ length: counts.sizeC }, (_, c) => `C${c}`);
  const time = imagejTimeAxis(imagej, counts.sizeT);
  return { ...common(base), isOme: false, ...counts, dimensionOrder: order, channelNames, pixelSize, planeIfd, warnings, time };
}

/** planeIfd when samples are channels: slot (z, c) → IFD of z (every channel shares it). */
function expandSamples(planes: readonly number[], spp: number): Int32Array {
  const map = new Int32Array(planes.length * spp);
  for (let c = 0; c < spp; c++) for (let z = 0; z < planes.length; z++) map[c * planes.length + z] = planes[z];
  return map;
}

/** planeIfd for several samples per pixel from a map with one channel: slot (z, c, t) → IFD of (z, t). */
function expandSamplesZt(single: Int32Array, spp: number, sizeZ: number, sizeT: number): Int32Array {
  const map = new Int32Array(sizeZ * spp * sizeT);
  for (let t = 0; t < sizeT; t++) for (let c = 0; c < spp; c++) for (let z = 0; z < sizeZ; z++) map[(t * spp + c) * sizeZ + z] = single[t * sizeZ + z];
  return map;
}

/** Indices of IFDs that are full-resolution (NewSubfileType bit 0 clear) and the size of IFD 0. */
async function fullResolutionIfds(source: ByteSource, base: BaseInfo, fileLabel: string): Promise<number[]> {
  const out: number[] = [0];
  for (let i = 1; i < base.ifds.length; i++) {
    const ifd = base.ifds[i];
    const subfile = await readNumber(source, base.header, ifd, Tag.NewSubfileType, fileLabel, 0);
    const w = await readNumber(source, base.header, ifd, Tag.ImageWidth, fileLabel, 0);
    const h = await readNumber(source, base.header, ifd, Tag.ImageLength, fileLabel, 0);
    if ((subfile & 1) === 0 && w === base.layout.widthPx && h === base.layout.heightPx) out.push(i);
  }
  return out;
}

/** Every mapped IFD must have the size of IFD 0 (OME: the TIFF structure is the truth). */
async function checkPlaneSizes(source: ByteSource, header: TiffHeader, ifds: readonly Ifd[], planeIfd: Int32Array, layout: ImageLayout, fileLabel: string, isOme: boolean): Promise<void> {
  const checked = new Set<number>([0]);
  for (const i of planeIfd) {
    if (checked.has(i)) continue;
    checked.add(i);
    const w = await readNumber(source, header, ifds[i], Tag.ImageWidth, fileLabel, 0);
    const h = await readNumber(source, header, ifds[i], Tag.ImageLength, fileLabel, 0);
    if (w !== layout.widthPx || h !== layout.heightPx) {
      throw new TiffError(isOme ? 'bad-ome' : 'unsupported', fileLabel, `IFD ${i} is ${w}×${h} but IFD 0 is ${layout.widthPx}×${layout.heightPx}`);
    }
  }
}

