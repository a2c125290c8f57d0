// OME-XML text for a single-image OME-TIFF (schema 2016-06 ome.xsd: Pixels, Channel, TiffData).
import type { DimensionOrder } from '../model';

/** What the XML describes. Physical sizes in µm. */
export interface OmeXmlFields {
  readonly sizeX: number;
  readonly sizeY: number;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  readonly dimensionOrder: DimensionOrder;
  /** OME Pixels@Type: uint8, int16, float, double… */
  readonly type: string;
  readonly channelNames: readonly string[];
  readonly physicalSizeXUm: number;
  readonly physicalSizeYUm: number;
  readonly physicalSizeZUm: number | null;
  /** Pixels/@TimeIncrement in seconds; null = not written. */
  readonly timeIncrementS?: number | null;
}

/** Escapes text for an XML attribute value. */
function attr(value: string): string {
  return value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** OME-XML with one Image whose planes are IFDs 0…n−1 in DimensionOrder. */
export function buildOmeXml(f: OmeXmlFields): string {
  const ns = 'http://www.openmicroscopy.org/Schemas/OME/2016-06';
  const mu = '\u00B5m';
  const z = f.physicalSizeZUm !== null ? ` PhysicalSizeZ="${f.physicalSizeZUm}" PhysicalSizeZUnit="${mu}"` : '';
  const time = f.timeIncrementS != null ? ` TimeIncrement="${f.timeIncrementS}" TimeIncrementUnit="s"` : '';
  const channels = f.channelNames.map((name, c) => `<Channel ID="Channel:0:${c}" Name="${attr(name)}" SamplesPerPixel="1"/>`);
  const planeCount = f.sizeZ * f.sizeC * f.sizeT;
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<OME xmlns="${ns}" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xsi:schemaLocation="${ns} ${ns}/ome.xsd" Creator="Eggline">`,
    '<Image ID="Image:0" Name="image">',
    `<Pixels ID="Pixels:0" DimensionOrder="${f.dimensionOrder}" Type="${f.type}" SizeX="${f.sizeX}" SizeY="${f.sizeY}" ` +
      `SizeZ="${f.sizeZ}" SizeC="${f.sizeC}" SizeT="${f.sizeT}" PhysicalSizeX="${f.physicalSizeXUm}" PhysicalSizeXUnit="${mu}" ` +
      `PhysicalSizeY="${f.physicalSizeYUm}" PhysicalSizeYUnit="${mu}"${z}${time} BigEndian="false">`,
    ...channels,
    `<TiffData IFD="0" PlaneCount="${planeCount}"/>`,
    '</Pixels>',
    '</Image>',
    '</OME>',
  ].join('\n');
}
