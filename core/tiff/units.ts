// Length units of OME PhysicalSize attributes (ome.xsd UnitsLength) converted to micrometres.

const UM_PER_UNIT: Record<string, number> = {
  m: 1e6, dm: 1e5, cm: 1e4, mm: 1e3,
  '\u00B5m': 1, '\u03BCm': 1, // micro sign (the ome.xsd default) and Greek mu
  um: 1, micron: 1, microns: 1,
  nm: 1e-3, pm: 1e-6,
  '\u00C5': 1e-4, '\u212B': 1e-4, // Å as Latin capital A with ring, and as the angstrom sign
  in: 25400,
};

/** µm per unit for an OME length unit (µm, um, μm, nm, mm, Å, cm, m…), or null for 'pixel' and unknown units. */
export function micrometresPerUnit(unit: string): number | null {
  return UM_PER_UNIT[unit.trim()] ?? null;
}
