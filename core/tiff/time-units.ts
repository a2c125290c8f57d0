// Time units of OME DeltaT and TimeIncrement (ome.xsd UnitsTime) and of ImageJ's tunit, converted to seconds.

const S_PER_UNIT: Record<string, number> = {
  s: 1, sec: 1, second: 1, seconds: 1,
  ms: 1e-3, '\u00B5s': 1e-6, '\u03BCs': 1e-6, us: 1e-6, ns: 1e-9,
  min: 60, minute: 60, minutes: 60,
  h: 3600, hr: 3600, hour: 3600, hours: 3600,
  d: 86400, day: 86400, days: 86400,
};

/** Seconds per unit for a time unit (s, ms, µs, ns, min, h, d and ImageJ's spelled-out names), or null. */
export function secondsPerUnit(unit: string): number | null {
  return S_PER_UNIT[unit.trim()] ?? null;
}
