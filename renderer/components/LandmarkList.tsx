// Landmarks of the shown embryo: name (editable), x/EL, µm, off-axis distance, delete.
import type { Dispatch } from 'react';
import { pointOnAxis } from '../../core/geometry';
import type { ApAxis, LandmarkPosition } from '../../core/model';
import type { EditorAction } from '../state';
import { fixed } from '../ui/format';

/** The landmark table. */
export function LandmarkList({ landmarks, selected, dispatch, axis }: { landmarks: readonly LandmarkPosition[]; selected: number | null; dispatch: Dispatch<EditorAction>; axis: ApAxis | null }) {
  return (
    <section className="panel landmarks" data-testid="landmark-list">
      <h3>Landmarks <span className="muted">tool L · click to place · Del removes</span></h3>
      <button disabled={axis === null} data-testid="add-landmark" title="Place a landmark at the middle of the axis; focus it on the image and move it with the arrow keys"
        onClick={() => { if (axis !== null) dispatch({ type: 'addLandmark', point: pointOnAxis(axis, 0.5) }); }}>+ landmark at mid-axis</button>
      {landmarks.length === 0 ? <p className="muted small">none</p> : (
        <table><thead><tr><th>name</th><th>x/EL</th><th>µm</th><th>off-axis µm</th><th /></tr></thead><tbody>
          {landmarks.map((l, i) => (
            <tr key={i} data-testid="landmark-row" data-name={l.name} className={selected === i ? 'selected' : ''} onClick={() => dispatch({ type: 'selectLandmark', index: i })}>
              <td><input className="name" defaultValue={l.name} key={l.name} onBlur={(e) => dispatch({ type: 'renameLandmark', index: i, name: e.target.value })}
                onKeyDown={(e) => { if (e.key === 'Enter') (e.target as HTMLInputElement).blur(); }} /></td>
              <td data-testid="landmark-xel">{fixed(l.xEl, 3)}</td><td>{fixed(l.xUm, 1)}</td><td>{fixed(l.offAxisUm, 1)}</td>
              <td><button title="delete landmark" onClick={(e) => { e.stopPropagation(); dispatch({ type: 'deleteLandmark', index: i }); }}>✕</button></td>
            </tr>
          ))}
        </tbody></table>
      )}
    </section>
  );
}
