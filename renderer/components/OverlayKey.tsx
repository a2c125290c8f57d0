// The key of the image overlays, each with a checkbox to show or hide it (reachable with Tab and Space).
import { BOUNDARY_COLOURS } from '../../core/figures';
import type { OverlayName, OverlayVisibility } from '../overlay/ImageOverlay';

const KEY: [OverlayName, string, string, string][] = [
  // name, label, swatch colour, swatch style
  ['outline', 'outline', '#e8e2c8', 'dashed'],
  ['band', 'sampled band', '#5fd3e0', 'solid'],
  ['axis', 'AP axis (A, P)', '#ffffff', 'solid'],
  ['boundaries', 'boundaries', BOUNDARY_COLOURS[0], 'dashed'],
  ['landmarks', 'landmarks', '#f4f6fa', 'dotted'],
];

/** Props of the key. */
export interface OverlayKeyProps {
  readonly visible: OverlayVisibility;
  readonly onChange: (v: OverlayVisibility) => void;
}

/** The overlay key with toggles. */
export function OverlayKey({ visible, onChange }: OverlayKeyProps) {
  return (
    <fieldset className="overlay-key" data-testid="overlay-key" onPointerDown={(e) => e.stopPropagation()}>
      <legend className="sr-only">Overlays</legend>
      {KEY.map(([name, label, colour, style]) => (
        <label key={name} title={`show or hide the ${label}`}>
          <input type="checkbox" checked={visible[name]} data-testid={`overlay-${name}`} onChange={(e) => onChange({ ...visible, [name]: e.target.checked })} />
          <span className="swatch" style={{ borderTopColor: colour, borderTopStyle: style as 'solid' }} />{label}
        </label>
      ))}
    </fieldset>
  );
}
