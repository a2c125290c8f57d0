// Which array dimension is x, y, z, channel and time, from NGFF axes in any order NGFF allows.
import { ZarrError } from './errors';
import type { NgffAxis } from './ngff';

/** Array dimension of each role, or -1 when the array has no such axis. */
export interface AxisRoles {
  readonly x: number;
  readonly y: number;
  readonly z: number;
  readonly c: number;
  readonly t: number;
}

type Role = keyof AxisRoles;

/** NGFF 0.1 and 0.2 had no axes metadata and always stored (t, c, z, y, x); shorter arrays keep the trailing names. */
const IMPLIED_NAMES = ['t', 'c', 'z', 'y', 'x'];

/** The axes of an array without axes metadata: the trailing names of (t, c, z, y, x). */
export function impliedAxes(dimensions: number): NgffAxis[] {
  return IMPLIED_NAMES.slice(5 - dimensions).map((name) => ({ name, type: name === 't' ? 'time' : name === 'c' ? 'channel' : 'space', unit: null }));
}

/** Role of an axis from its type, or from its name when the type is missing. */
function roleOf(axis: NgffAxis): 'space' | 'c' | 't' | null {
  const name = axis.name.toLowerCase();
  const type = axis.type?.toLowerCase() ?? null;
  if (type === 'time' || (type === null && name === 't')) return 't';
  if (type === 'channel' || (type === null && name === 'c')) return 'c';
  if (type === 'space' || (type === null && (name === 'x' || name === 'y' || name === 'z'))) return 'space';
  return null;
}

/** Space axes to x, y, z: by name when they are named x, y, z; else by position (the last is x, then y, then z). */
function spaceRoles(axes: readonly NgffAxis[], dims: readonly number[], label: string): Partial<Record<Role, number>> {
  if (dims.length < 2) throw new ZarrError('unsupported', label, `has ${dims.length} space axis; Eggline needs y and x`);
  if (dims.length > 3) throw new ZarrError('unsupported', label, `has ${dims.length} space axes; Eggline reads at most z, y and x`);
  const names = dims.map((d) => axes[d].name.toLowerCase());
  if (names.every((n) => n === 'x' || n === 'y' || n === 'z') && new Set(names).size === names.length && names.includes('x') && names.includes('y')) {
    return Object.fromEntries(dims.map((d, i) => [names[i], d]));
  }
  const [x, y, z] = [...dims].reverse();
  return z === undefined ? { x, y } : { x, y, z };
}

/** Assigns x, y, z, c, t to array dimensions; throws ZarrError when the axes do not fit a 2–5-dimensional image. */
export function assignAxisRoles(axes: readonly NgffAxis[], shape: readonly number[], label: string): AxisRoles {
  if (shape.length < 2 || shape.length > 5) {
    throw new ZarrError('unsupported', label, `the image has ${shape.length} dimensions; Eggline reads 2 to 5 (x, y and optionally z, channel, time)`);
  }
  if (axes.length !== shape.length) {
    throw new ZarrError('bad-metadata', label, `NGFF declares ${axes.length} axes but the array has ${shape.length} dimensions`);
  }
  const roles: Partial<Record<Role, number>> = {};
  const space: number[] = [];
  axes.forEach((axis, d) => {
    const role = roleOf(axis);
    if (role === 'space') { space.push(d); return; }
    if (role === null) {
      if (shape[d] === 1) return;
      throw new ZarrError('unsupported', label, `axis "${axis.name}" (type ${axis.type ?? 'none'}) has ${shape[d]} entries; only space, channel and time axes are read`);
    }
    if (roles[role] !== undefined) throw new ZarrError('unsupported', label, `has more than one ${role === 'c' ? 'channel' : 'time'} axis`);
    roles[role] = d;
  });
  Object.assign(roles, spaceRoles(axes, space, label));
  return { x: roles.x ?? -1, y: roles.y ?? -1, z: roles.z ?? -1, c: roles.c ?? -1, t: roles.t ?? -1 };
}
