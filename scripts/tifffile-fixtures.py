# Writes TIFF test fixtures with Python's tifffile (an independent writer) into the folder given as argv[1].
# Pixel values follow patternValue('uint16', n, x, y) in scripts/make-tiff-fixtures.ts:
# (x*1031 + y*257 + n*4099 + 17) & 0xFFFF on a 33 x 17 image. Run by make-tiff-fixtures.ts with /usr/bin/python3.
import os
import sys

import numpy as np
import tifffile

W, H = 33, 17


def plane(n):
    y, x = np.mgrid[0:H, 0:W]
    return ((x * 1031 + y * 257 + n * 4099 + 17) & 0xFFFF).astype(np.uint16)


def main(out):
    # Z=3, C=2 pages in row-major order (page = z*2 + c) with tifffile's default {"shape": [3, 2, 17, 33]}.
    zc = np.stack([np.stack([plane(z * 2 + c) for c in range(2)]) for z in range(3)])
    tifffile.imwrite(os.path.join(out, 'tifffile-zcyx.tif'), zc)
    tifffile.imwrite(os.path.join(out, 'tifffile-zcyx-zlib.tif'), zc, compression='zlib', predictor=True)
    # Two samples per pixel, min-is-black (not colour): sample s of z holds plane(z*2 + s).
    zyxs = np.stack([np.stack([plane(z * 2 + s) for s in range(2)], axis=-1) for z in range(3)])
    tifffile.imwrite(os.path.join(out, 'tifffile-2samples.tif'), zyxs, photometric='minisblack', planarconfig='contig')
    tifffile.imwrite(os.path.join(out, 'tifffile-2samples-planar-lzma.tif'), np.moveaxis(zyxs, -1, 1), photometric='minisblack', planarconfig='separate', compression='lzma')
    # Tiled BigTIFF, Deflate with the horizontal predictor.
    tifffile.imwrite(os.path.join(out, 'tifffile-zcyx-tiled-bigtiff.tif'), zc, bigtiff=True, tile=(16, 16), compression='zlib', predictor=True)


if __name__ == '__main__':
    main(sys.argv[1])
