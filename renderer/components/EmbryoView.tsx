// The embryo tab: the image above, the straightened strip and the profile plot below, with a bar between them that
// resizes the two (so the image and the profile's x axis are on screen together at any window size).
import { useRef, useState } from 'react';
import type { Dispatch } from 'react';
import type { ApAxis, ImagePoint, Plane } from '../../core/model';
import { useElementSize } from '../hooks/useElementSize';
import type { LiveMeasurement } from '../live';
import type { EditorAction, EditorState } from '../state';
import { lowerPaneLayout, profilePaneHeightPx } from '../ui/splitLayout';
import type { OverlayVisibility } from './ImageOverlay';
import { ImageView } from './ImageView';
import { ProfilePlot } from './ProfilePlot';
import { SplitBar } from './SplitBar';
import { StraightView } from './StraightView';

/** Props of the embryo view. */
export interface EmbryoViewProps {
  readonly state: EditorState;
  readonly dispatch: Dispatch<EditorAction>;
  readonly planes: readonly Plane[];
  readonly channelNames: readonly string[];
  readonly outline: readonly ImagePoint[];
  readonly axis: ApAxis | null;
  readonly measurement: LiveMeasurement | null;
  readonly bandOutlines: readonly (readonly ImagePoint[])[];
  readonly fitRangeEl: readonly [number, number];
  readonly pixelSizeUm: number | null;
  readonly halfWidthPx: number;
  readonly fitRequest: number;
  readonly spaceHeld: boolean;
  readonly overlays: OverlayVisibility;
  readonly onOverlays: (v: OverlayVisibility) => void;
  readonly readoutTarget: HTMLElement | null;
  readonly loadError: string | null;
  readonly hidden: boolean;
}

/** The embryo view. */
export function EmbryoView(p: EmbryoViewProps) {
  const box = useRef<HTMLDivElement>(null);
  const size = useElementSize(box);
  const [fraction, setFraction] = useState(0.5);
  const paneH = profilePaneHeightPx(size.height, fraction);
  const { stripPx, plotPx } = lowerPaneLayout(paneH);
  const width = Math.max(200, size.width);
  return (
    <div className={p.hidden ? 'hidden' : 'embryo-view'} ref={box} data-testid="embryo-view">
      {p.loadError && <div className="error load-error" data-testid="load-error" title={p.loadError}>{p.loadError}</div>}
      <ImageView state={p.state} dispatch={p.dispatch} planes={p.planes} channelNames={p.channelNames} outline={p.outline} axis={p.axis}
        measurement={p.measurement} bandOutlines={p.bandOutlines} fitRangeEl={p.fitRangeEl} pixelSizeUm={p.pixelSizeUm} halfWidthPx={p.halfWidthPx}
        fitRequest={p.fitRequest} spaceHeld={p.spaceHeld} overlays={p.overlays} onOverlays={p.onOverlays} readoutTarget={p.readoutTarget} />
      <SplitBar fraction={fraction} onFraction={setFraction} totalPx={size.height} />
      <div className="profile-pane" style={{ height: paneH }}>
        <StraightView measurement={p.measurement} display={p.state.display} width={width} fitRangeEl={p.fitRangeEl} height={stripPx} />
        <ProfilePlot measurement={p.measurement} width={width} height={plotPx} fitRangeEl={p.fitRangeEl} dispatch={p.dispatch} />
      </div>
    </div>
  );
}
