// An in-memory StackInfo + PlaneSource over a synthetic embryo, for tests, benchmarks and the demo.
import type { PlaneSource, StackInfo } from '../model';
import type { SyntheticEmbryo } from './embryo';

/** StackInfo describing a synthetic stack (XYZCT, uint16, pixel size as if read from OME metadata). */
export function syntheticStackInfo(embryo: SyntheticEmbryo): StackInfo {
  const { sizeX, sizeY, sizeZ, sizeC } = embryo.stack;
  const planeIfd = new Int32Array(sizeZ * sizeC);
  for (let i = 0; i < planeIfd.length; i++) planeIfd[i] = i;
  return {
    byteOrder: 'II', bigTiff: false, isOme: true, sizeX, sizeY, sizeZ, sizeC, sizeT: 1,
    dimensionOrder: 'XYZCT', sampleType: 'uint16', samplesPerPixel: 1, channelNames: [...embryo.channelNames],
    pixelSize: { xUm: embryo.pixelSizeUm, yUm: embryo.pixelSizeUm, zUm: embryo.params.zStepUm, source: 'ome' },
    compression: 'none', planeIfd, ifdCount: planeIfd.length, description: null, warnings: [],
  };
}

/** PlaneSource reading the synthetic planes (plane (z, c, 0) = planes[c·sizeZ + z]). */
export function syntheticPlaneSource(embryo: SyntheticEmbryo): PlaneSource {
  const { sizeX, sizeY, sizeZ, sizeC, planes } = embryo.stack;
  return {
    async readPlane(z, c, t) {
      if (z < 0 || z >= sizeZ || c < 0 || c >= sizeC || t !== 0) throw new Error(`no plane z=${z} c=${c} t=${t}`);
      return { width: sizeX, height: sizeY, data: planes[c * sizeZ + z] };
    },
    async close() { /* nothing to release */ },
  };
}
