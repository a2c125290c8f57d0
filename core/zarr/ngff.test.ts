import { describe, expect, it } from 'vitest';
import { parseNgffGroup, type NgffImage } from './ngff';

/** The image of a group that must parse as one. */
function image(attrs: unknown): NgffImage {
  const g = parseNgffGroup(attrs, 'a.ome.zarr');
  if (g.kind !== 'image') throw new Error('not an image');
  return g.image;
}

// Source: NGFF 0.4 specification, examples/multiscales_strict/multiscales_example.json (the "multiscales" example).
const NGFF_04_MULTISCALES = {
  multiscales: [{
    version: '0.4', name: 'example',
    axes: [
      { name: 't', type: 'time', unit: 'millisecond' }, { name: 'c', type: 'channel' },
      { name: 'z', type: 'space', unit: 'micrometer' }, { name: 'y', type: 'space', unit: 'micrometer' }, { name: 'x', type: 'space', unit: 'micrometer' },
    ],
    datasets: [
      { path: '0', coordinateTransformations: [{ type: 'scale', scale: [1.0, 1.0, 0.5, 0.5, 0.5] }] },
      { path: '1', coordinateTransformations: [{ type: 'scale', scale: [1.0, 1.0, 1.0, 1.0, 1.0] }] },
      { path: '2', coordinateTransformations: [{ type: 'scale', scale: [1.0, 1.0, 2.0, 2.0, 2.0] }] },
    ],
    coordinateTransformations: [{ type: 'scale', scale: [0.1, 1.0, 1.0, 1.0, 1.0] }],
    type: 'gaussian',
  }],
};

describe('parseNgffGroup', () => {
  it('reads the NGFF 0.4 multiscales example: finest level, axes with units, dataset × multiscale scale', () => {
    const im = image(NGFF_04_MULTISCALES);
    expect(im.version).toBe('0.4');
    expect(im.datasetPath).toBe('0');
    expect(im.levels).toBe(3);
    expect(im.axes!.map((a) => [a.name, a.type, a.unit])).toEqual([
      ['t', 'time', 'millisecond'], ['c', 'channel', null], ['z', 'space', 'micrometer'], ['y', 'space', 'micrometer'], ['x', 'space', 'micrometer'],
    ]);
    // Source: NGFF 0.4 — the example's comments: voxel size 0.5 µm at level 0, time unit 0.1 ms for every level.
    expect(im.scale).toEqual([0.1, 1, 0.5, 0.5, 0.5]);
    expect(im.channelNames).toEqual([]);
    expect(im.warnings).toEqual([]);
  });

  it('reads the same example in NGFF 0.5 form (keys under "ome", version there, none in multiscales)', () => {
    // Source: NGFF 0.5 specification — OME-Zarr metadata lives in zarr.json attributes under "ome" with "version".
    const { version: _unused, ...ms } = NGFF_04_MULTISCALES.multiscales[0];
    const im = image({ ome: { version: '0.5', multiscales: [ms] } });
    expect(im.version).toBe('0.5');
    expect(im.scale).toEqual([0.1, 1, 0.5, 0.5, 0.5]);
    expect(im.datasetPath).toBe('0');
  });

  it('reads omero channel labels and takes the scale (not the translation) of the NGFF 0.4 omero example', () => {
    // Source: NGFF 0.4 specification, examples/valid_strict/image_omero.json (which spells the axis key "units").
    const im = image({
      multiscales: [{
        version: '0.4', name: 'image_with_omero_metadata',
        axes: [{ name: 't', type: 'time' }, { name: 'c', type: 'channel' }, { name: 'z', type: 'space', units: 'micrometer' },
          { name: 'y', type: 'space', units: 'micrometer' }, { name: 'x', type: 'space', units: 'micrometer' }],
        datasets: [
          { path: '0', coordinateTransformations: [{ scale: [1, 1, 0.5, 0.13, 0.13], type: 'scale' }, { translation: [0, 9, 0.5, 25.74, 21.58], type: 'translation' }] },
          { path: '1', coordinateTransformations: [{ scale: [1, 1, 1, 0.26, 0.26], type: 'scale' }] },
        ],
      }],
      omero: { channels: [{ label: 'FITC', color: '00FF00' }, { label: 'RD-TR-PE', color: 'FF0000' }], id: 1, version: '0.4' },
    });
    expect(im.scale).toEqual([1, 1, 0.5, 0.13, 0.13]);
    expect(im.channelNames).toEqual(['FITC', 'RD-TR-PE']);
    expect(im.axes![4].unit).toBe('micrometer');
  });

  it('multiplies the multiscale-level scale into the dataset scale (NGFF 0.4 multiscales_transformations example)', () => {
    // Source: NGFF 0.4 specification, examples/valid_strict/multiscales_transformations.json: dataset scale [1, 1],
    // multiscales scale [10, 10] → 10 per pixel.
    const im = image({
      multiscales: [{
        version: '0.4', axes: [{ name: 'y', type: 'space', unit: 'micrometer' }, { name: 'x', type: 'space', unit: 'micrometer' }],
        datasets: [{ path: '0', coordinateTransformations: [{ scale: [1, 1], type: 'scale' }] }],
        coordinateTransformations: [{ scale: [10, 10], type: 'scale' }],
      }],
    });
    expect(im.scale).toEqual([10, 10]);
  });

  it('accepts NGFF 0.3 axes given as names and 0.2 files with none', () => {
    expect(image({ multiscales: [{ version: '0.3', axes: ['c', 'y', 'x'], datasets: [{ path: '0' }] }] }).axes!.map((a) => a.name)).toEqual(['c', 'y', 'x']);
    const old = image({ multiscales: [{ version: '0.2', datasets: [{ path: '0' }, { path: '1' }] }] });
    expect([old.axes, old.scale, old.version]).toEqual([null, null, '0.2']);
  });

  it('sees a bioformats2raw collection and refuses plates and wells', () => {
    // Source: NGFF 0.4/0.5 specification — "bioformats2raw.layout": 3 marks a collection; "plate" and "well" groups
    // (examples plate_strict/plate_2wells.json, well_strict/well_2fields.json).
    expect(parseNgffGroup({ 'bioformats2raw.layout': 3 }, 'a.zarr')).toEqual({ kind: 'collection' });
    expect(parseNgffGroup({ ome: { version: '0.5', 'bioformats2raw.layout': 3 } }, 'a.zarr')).toEqual({ kind: 'collection' });
    expect(() => parseNgffGroup({ plate: { rows: [{ name: 'A' }], columns: [{ name: '1' }], wells: [{ path: 'A/1' }] } }, 'p.ome.zarr'))
      .toThrow('p.ome.zarr: is an OME-Zarr plate (several wells and fields); plates are not read yet');
    expect(() => parseNgffGroup({ ome: { version: '0.5', well: { images: [{ path: '0' }, { path: '1' }] } } }, 'w.ome.zarr'))
      .toThrow('w.ome.zarr: is an OME-Zarr well (several fields of view); wells are not read yet');
  });

  it('gives one-line messages for missing or malformed multiscales', () => {
    const cases: [unknown, string][] = [
      [[], 'a.ome.zarr: group attributes are not a JSON object'],
      [{}, 'a.ome.zarr: has no NGFF "multiscales" metadata: not an OME-Zarr image'],
      [{ multiscales: [] }, 'a.ome.zarr: NGFF "multiscales" is not a list of images'],
      [{ multiscales: [{ axes: ['y', 'x'] }] }, 'a.ome.zarr: NGFF multiscales has no datasets'],
      [{ multiscales: [{ axes: ['y', 'x'], datasets: [{}] }] }, 'a.ome.zarr: the first NGFF dataset has no path'],
      [{ multiscales: [{ axes: ['y', 'x'], datasets: [{ path: '../x' }] }] }, 'a.ome.zarr: NGFF dataset path "../x" leaves the store'],
      [{ multiscales: [{ axes: 'yx', datasets: [{ path: '0' }] }] }, 'a.ome.zarr: NGFF "axes" is not a list of axes'],
      [{ multiscales: [{ axes: [{ type: 'space' }], datasets: [{ path: '0' }] }] }, 'a.ome.zarr: NGFF axis 1 has no name'],
      [{ multiscales: [{ axes: ['y', 'x'], datasets: [{ path: '0', coordinateTransformations: [{ type: 'scale', scale: [1] }] }] }] },
        'a.ome.zarr: dataset scale has 1 values for 2 axes'],
      [{ multiscales: [{ axes: ['y', 'x'], datasets: [{ path: '0', coordinateTransformations: [{ type: 'scale', scale: [1, -2] }] }] }] },
        'a.ome.zarr: dataset scale must be a list of positive numbers'],
    ];
    for (const [attrs, message] of cases) expect(() => parseNgffGroup(attrs, 'a.ome.zarr')).toThrow(message);
  });

  it('warns when a group holds several multiscale images and reads the first', () => {
    const one = NGFF_04_MULTISCALES.multiscales[0];
    expect(image({ multiscales: [one, { ...one, datasets: [{ path: 'b' }] }] }).warnings).toEqual(['a.ome.zarr: 2 multiscale images in one group; the first is read']);
  });
});
