#!/usr/bin/python3
"""Write sharded OME-Zarr (NGFF 0.5, Zarr v3) copies of an OME-TIFF stack, byte by byte from the specification.

Debian's python3-zarr 2.13 cannot write Zarr v3 and zarrita cannot write sharded arrays, so the shards are laid out
here directly from the Zarr v3.0 core specification and its sharding codec ("sharding_indexed", version 1.0): each
shard file holds its inner chunks, each encoded by the inner codecs, and an index of (offset, nbytes) pairs of uint64
little-endian per inner chunk in C order, encoded by the index codecs (bytes, optionally crc32c: a CRC-32C of the
index appended, 4 bytes little-endian), at the end of the shard (index_location "end", the default) or at its start.
An inner chunk that is not stored has offset and nbytes 2^64 - 1 and reads as the fill value. Pixels come from
tifffile; Blosc from numcodecs. Run with /usr/bin/python3:

    make-zarr-sharded-fixtures.py STACK.ome.tif OUT_FOLDER --pixel-size-um 3 --z-step-um 2 --channels a,b

Prints one line per store written: its name.
"""
import argparse
import importlib.util
import json
import os
import struct

import numpy as np
from numcodecs import Blosc

HERE = os.path.dirname(os.path.abspath(__file__))
_spec = importlib.util.spec_from_file_location('fixtures_v2', os.path.join(HERE, 'make-zarr-fixtures.py'))
fixtures_v2 = importlib.util.module_from_spec(_spec)
_spec.loader.exec_module(fixtures_v2)

EMPTY = 2 ** 64 - 1
BYTES_LE = {'name': 'bytes', 'configuration': {'endian': 'little'}}
CRC32C = {'name': 'crc32c'}
BLOSC_LZ4 = {'name': 'blosc', 'configuration': {'cname': 'lz4', 'clevel': 5, 'shuffle': 'shuffle', 'typesize': 2, 'blocksize': 0}}

# name -> (shard shape over (t, c, z), inner codecs, index codecs, index location, inner chunks (c, z) left out)
# Inner chunks are one plane (1, 1, 1, Y, X); a shard covers all of y and x.
CASES = {
    # Shards of two z planes: the last shard of each channel covers z = 2 and 3, and z = 3 lies outside the array
    # (the writer stores no chunk for it).
    'v3-sharded': ((1, 1, 2), [BYTES_LE], [BYTES_LE, CRC32C], 'end', []),
    'v3-sharded-blosc-start': ((1, 2, 3), [BYTES_LE, BLOSC_LZ4], [BYTES_LE], 'start', []),
    # One inner chunk left out on purpose: it reads as the fill value (0).
    'v3-sharded-empty-chunk': ((1, 1, 3), [BYTES_LE], [BYTES_LE, CRC32C], 'end', [(1, 1)]),
}


def crc32c(data):
    """CRC-32C (Castagnoli, reflected polynomial 0x82F63B78), as the crc32c codec appends it (RFC 3720 B.4)."""
    crc = 0xFFFFFFFF
    for byte in data:
        crc ^= byte
        for _ in range(8):
            crc = (crc >> 1) ^ (0x82F63B78 if crc & 1 else 0)
    return crc ^ 0xFFFFFFFF


def encode_inner(plane, codecs):
    """One inner chunk through the inner codecs: little-endian bytes, then Blosc when listed."""
    raw = plane.astype('<u2').tobytes()
    for codec in codecs[1:]:
        c = codec['configuration']
        raw = Blosc(cname=c['cname'], clevel=c['clevel'], shuffle=Blosc.SHUFFLE, blocksize=c['blocksize']).encode(np.frombuffer(raw, dtype='<u2'))
    return bytes(raw)


def encode_index(pairs, codecs):
    """The shard index: (offset, nbytes) uint64 little-endian per inner chunk, then the CRC-32C when listed."""
    raw = b''.join(struct.pack('<QQ', offset, nbytes) for offset, nbytes in pairs)
    if CRC32C in codecs:
        raw += struct.pack('<I', crc32c(raw))
    return raw


def write_json(path, obj):
    os.makedirs(os.path.dirname(path), exist_ok=True)
    with open(path, 'w') as f:
        json.dump(obj, f, indent=2)


def write_store(data, out, name, scale, channels):
    shard_tcz, inner_codecs, index_codecs, location, left_out = CASES[name]
    t_n, c_n, z_n, y_n, x_n = data.shape
    root = os.path.join(out, name + '.ome.zarr')
    shard_shape = [shard_tcz[0], shard_tcz[1], shard_tcz[2], y_n, x_n]
    inner = [1, 1, 1, y_n, x_n]
    axes = [{'name': 't', 'type': 'time', 'unit': 'second'}, {'name': 'c', 'type': 'channel'}] + \
        [{'name': n, 'type': 'space', 'unit': 'micrometer'} for n in 'zyx']
    write_json(os.path.join(root, 'zarr.json'), {
        'zarr_format': 3, 'node_type': 'group',
        'attributes': {'ome': {
            'version': '0.5',
            'multiscales': [{'name': name, 'axes': axes, 'datasets': [{'path': '0', 'coordinateTransformations': [{'type': 'scale', 'scale': scale}]}]}],
            'omero': {'channels': [{'label': c, 'color': 'FFFFFF', 'window': {'start': 0, 'end': 65535, 'min': 0, 'max': 65535}} for c in channels]},
        }},
    })
    write_json(os.path.join(root, '0', 'zarr.json'), {
        'zarr_format': 3, 'node_type': 'array', 'shape': list(data.shape), 'data_type': 'uint16',
        'chunk_grid': {'name': 'regular', 'configuration': {'chunk_shape': shard_shape}},
        'chunk_key_encoding': {'name': 'default', 'configuration': {'separator': '/'}},
        'fill_value': 0,
        'codecs': [{'name': 'sharding_indexed', 'configuration': {
            'chunk_shape': inner, 'codecs': inner_codecs, 'index_codecs': index_codecs, 'index_location': location,
        }}],
        'dimension_names': ['t', 'c', 'z', 'y', 'x'],
    })
    per_shard = shard_tcz[0] * shard_tcz[1] * shard_tcz[2]
    index_bytes = len(encode_index([(0, 0)] * per_shard, index_codecs))
    for st in range(-(-t_n // shard_tcz[0])):
        for sc in range(-(-c_n // shard_tcz[1])):
            for sz in range(-(-z_n // shard_tcz[2])):
                chunks = []
                pairs = []
                at = index_bytes if location == 'start' else 0
                # Inner chunks in C order over (t, c, z) inside the shard.
                for it in range(shard_tcz[0]):
                    for ic in range(shard_tcz[1]):
                        for iz in range(shard_tcz[2]):
                            t, c, z = st * shard_tcz[0] + it, sc * shard_tcz[1] + ic, sz * shard_tcz[2] + iz
                            if t >= t_n or c >= c_n or z >= z_n or (c, z) in left_out:
                                pairs.append((EMPTY, EMPTY))
                                continue
                            encoded = encode_inner(data[t, c, z], inner_codecs)
                            pairs.append((at, len(encoded)))
                            chunks.append(encoded)
                            at += len(encoded)
                index = encode_index(pairs, index_codecs)
                body = b''.join(chunks)
                path = os.path.join(root, '0', 'c', str(st), str(sc), str(sz), '0', '0')
                os.makedirs(os.path.dirname(path), exist_ok=True)
                with open(path, 'wb') as f:
                    f.write(index + body if location == 'start' else body + index)
    return name


def main():
    parser = argparse.ArgumentParser(description=__doc__.split('\n')[0])
    parser.add_argument('tiff')
    parser.add_argument('out')
    parser.add_argument('--pixel-size-um', type=float, required=True)
    parser.add_argument('--z-step-um', type=float, required=True)
    parser.add_argument('--channels', required=True)
    args = parser.parse_args()
    data = fixtures_v2.read_tczyx(args.tiff)
    scale = [1.0, 1.0, args.z_step_um, args.pixel_size_um, args.pixel_size_um]
    for name in CASES:
        print(write_store(data, args.out, name, scale, args.channels.split(',')))


if __name__ == '__main__':
    main()
