// Half-maximum boundary of a profile, for live display.
import type { Boundary, Profile } from '../../core/model';

/**
 * x/EL where the profile first crosses halfway between its maximum and minimum, going from the maximum
 * towards the minimum (linear interpolation between bin centres).
 */
export function halfMaxBoundary(profile: Profile, eggLengthUm: number): Boundary {
  const none = (note: string): Boundary => ({ channel: profile.channel, method: 'half-max', positionEl: null, positionUm: null, widthEl: null, positionSeEl: null, direction: null, note });
  let iMax = -1, iMin = -1;
  profile.mean.forEach((v, i) => {
    if (!Number.isFinite(v)) return;
    if (iMax < 0 || v > profile.mean[iMax]) iMax = i;
    if (iMin < 0 || v < profile.mean[iMin]) iMin = i;
  });
  if (iMax < 0 || profile.mean[iMax] === profile.mean[iMin]) return none('flat profile');
  const half = (profile.mean[iMax] + profile.mean[iMin]) / 2;
  const step = iMin > iMax ? 1 : -1;
  for (let i = iMax; i !== iMin; i += step) {
    const a = profile.mean[i], b = profile.mean[i + step];
    if (!Number.isFinite(a) || !Number.isFinite(b) || b > half) continue;
    const t = (a - half) / (a - b);
    const x = profile.xEl[i] + t * (profile.xEl[i + step] - profile.xEl[i]);
    return { ...none(''), positionEl: x, positionUm: x * eggLengthUm, direction: step > 0 ? 'falling' : 'rising', note: null };
  }
  return none('no crossing');
}
