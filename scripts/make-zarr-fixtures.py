#!/usr/bin/python3
"""Write OME-Zarr (NGFF 0.4, Zarr v2) copies of an OME-TIFF stack with Python's zarr and numcodecs.

The pixels are read from the OME-TIFF by tifffile, so every store holds exactly the TIFF's pixels; each store uses one
codec, chunk shape, key separator or axis layout. Used by the tests as an independent writer (Debian's python3-zarr,
python3-numcodecs and python3-tifffile). Run with /usr/bin/python3:

    make-zarr-fixtures.py STACK.ome.tif OUT_FOLDER --pixel-size-um 3 --z-step-um 2 --channels a,b [CASE ...]

Prints one line per store written: its name. With no CASE, writes every case below.
"""
import argparse
import json
import os
import sys

import numcodecs
import numpy as np
import tifffile
import zarr
from numcodecs import Blosc, GZip, Zlib, Zstd

# name -> (compressor, chunks per axis of (t, c, z, y, x) or None for one plane, key separator, layout)
# layout: 'tczyx' (5-D), 'czyx' (no time axis), 'zyx-c0' (the first channel only, 3-D), 'f-order' (Fortran order)
CASES = {
    'blosc-lz4': (Blosc(cname='lz4', clevel=5, shuffle=Blosc.SHUFFLE), None, '.', 'tczyx'),
    'blosc-lz4hc': (Blosc(cname='lz4hc', clevel=5, shuffle=Blosc.SHUFFLE), None, '.', 'tczyx'),
    'blosc-zstd': (Blosc(cname='zstd', clevel=3, shuffle=Blosc.BITSHUFFLE), None, '.', 'tczyx'),
    'blosc-zlib': (Blosc(cname='zlib', clevel=5, shuffle=Blosc.SHUFFLE), None, '.', 'tczyx'),
    'blosc-blosclz': (Blosc(cname='blosclz', clevel=5, shuffle=Blosc.NOSHUFFLE), None, '.', 'tczyx'),
    'zlib': (Zlib(level=1), None, '.', 'tczyx'),
    'gzip': (GZip(level=5), None, '.', 'tczyx'),
    'zstd': (Zstd(level=3), None, '.', 'tczyx'),
    'none': (None, None, '.', 'tczyx'),
    'blosc-lz4-slash-tiles': (Blosc(cname='lz4', clevel=5, shuffle=Blosc.SHUFFLE), (1, 1, 2, 48, 40), '/', 'tczyx'),
    'zlib-czyx-whole-stack': (Zlib(level=6), (2, 4, 256, 256), '.', 'czyx'),
    'zstd-slash-f-order': (Zstd(level=1), (1, 1, 1, 64, 64), '/', 'f-order'),
    # Three resolution levels: 0 the stack, 1 and 2 every 2nd and 4th pixel along y and x (numpy slicing [::2, ::2]).
    'blosc-lz4-pyramid': (Blosc(cname='lz4', clevel=5, shuffle=Blosc.SHUFFLE), None, '.', 'pyramid'),
}
PYRAMID_LEVELS = 3


def read_tczyx(path):
    """The OME-TIFF's pixels as a 5-D (t, c, z, y, x) array."""
    with tifffile.TiffFile(path) as tif:
        series = tif.series[0]
        data = series.asarray()
        axes = series.axes
    for i, axis in enumerate('TCZYX'):
        if axis not in axes:
            data = np.expand_dims(data, 0)
            axes = axis + axes
    order = [axes.index(a) for a in 'TCZYX']
    return np.ascontiguousarray(np.transpose(data, order))


def ngff_attrs(names, scale, channels, levels=1):
    """NGFF 0.4 .zattrs for one image with `levels` resolution levels, each halving y and x."""
    units = {'t': 'second', 'z': 'micrometer', 'y': 'micrometer', 'x': 'micrometer'}
    types = {'t': 'time', 'c': 'channel'}
    axes = []
    for name in names:
        axis = {'name': name, 'type': types.get(name, 'space')}
        if name in units:
            axis['unit'] = units[name]
        axes.append(axis)
    return {
        'multiscales': [{
            'version': '0.4',
            'name': 'demo',
            'axes': axes,
            'datasets': [{'path': str(k), 'coordinateTransformations': [{'type': 'scale', 'scale': scale[:-2] + [v * 2 ** k for v in scale[-2:]]}]}
                         for k in range(levels)],
        }],
        'omero': {'channels': [{'label': c, 'color': 'FFFFFF', 'window': {'start': 0, 'end': 65535, 'min': 0, 'max': 65535}} for c in channels]},
    }


def write_case(name, stack, out, pixel_um, z_um, channels):
    compressor, chunks, separator, layout = CASES[name]
    scale5 = [1.0, 1.0, z_um, pixel_um, pixel_um]
    names = 'tczyx'
    data = stack
    order = 'C'
    if layout == 'czyx':
        data, names, scale5 = stack[0], 'czyx', scale5[1:]
    elif layout == 'f-order':
        order = 'F'
    if chunks is None:
        chunks = (1,) * (data.ndim - 2) + data.shape[-2:]
    path = os.path.join(out, f'{name}.ome.zarr')
    store = zarr.DirectoryStore(path, dimension_separator=separator)
    root = zarr.group(store=store, overwrite=True)
    levels = PYRAMID_LEVELS if layout == 'pyramid' else 1
    root.attrs.put(ngff_attrs(names, scale5, channels, levels))
    for k in range(levels):
        level = np.ascontiguousarray(data[..., ::2 ** k, ::2 ** k])
        array = root.create_dataset(str(k), shape=level.shape, chunks=chunks[:-2] + level.shape[-2:] if k else chunks,
                                    dtype=data.dtype, compressor=compressor, order=order, dimension_separator=separator)
        array[...] = level
    return path


def main():
    parser = argparse.ArgumentParser()
    parser.add_argument('tiff')
    parser.add_argument('out')
    parser.add_argument('--pixel-size-um', type=float, required=True)
    parser.add_argument('--z-step-um', type=float, required=True)
    parser.add_argument('--channels', required=True)
    parser.add_argument('cases', nargs='*')
    args = parser.parse_intermixed_args()
    stack = read_tczyx(args.tiff)
    channels = args.channels.split(',')
    os.makedirs(args.out, exist_ok=True)
    for name in args.cases or CASES:
        write_case(name, stack, args.out, args.pixel_size_um, args.z_step_um, channels)
        print(name)
    sys.stdout.flush()


if __name__ == '__main__':
    main()
