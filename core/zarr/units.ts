// NGFF axis units (UDUNITS-2 names, as the NGFF specification lists them) converted to micrometres and seconds.

/** Micrometres per unit for the space units NGFF allows, plus the short spellings writers commonly use. */
const SPACE_UM: Readonly<Record<string, number>> = {
  angstrom: 1e-4,
  picometer: 1e-6,
  nanometer: 1e-3,
  micrometer: 1,
  millimeter: 1e3,
  centimeter: 1e4,
  decimeter: 1e5,
  meter: 1e6,
  // Short spellings (common practice in files written by hand; not NGFF names).
  nm: 1e-3,
  um: 1,
  'µm': 1,
  'μm': 1,
  mm: 1e3,
};

/** Seconds per unit for the time units NGFF allows. */
const TIME_S: Readonly<Record<string, number>> = {
  picosecond: 1e-12,
  nanosecond: 1e-9,
  microsecond: 1e-6,
  millisecond: 1e-3,
  second: 1,
  minute: 60,
  hour: 3600,
  day: 86400,
  ms: 1e-3,
  s: 1,
  min: 60,
  h: 3600,
};

/** Micrometres per `unit` (a space unit), or null when the unit is missing or not one we know. */
export function micrometresPerSpaceUnit(unit: string | null): number | null {
  return unit === null ? null : SPACE_UM[unit.trim().toLowerCase()] ?? SPACE_UM[unit.trim()] ?? null;
}

/** Seconds per `unit` (a time unit), or null when the unit is missing or not one we know. */
export function secondsPerTimeUnit(unit: string | null): number | null {
  return unit === null ? null : TIME_S[unit.trim().toLowerCase()] ?? null;
}
