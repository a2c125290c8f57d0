// The embryo tab: the image above, the straightened strip and the profile plot below, with a bar between them that
// resizes the two (so the image and the profile's x axis are on screen together at any window size).
import { useRef, useState } from 'react';
import { useElementSize } from '../hooks/useElementSize';
import { lowerPaneLayout, profilePaneHeightPx } from '../ui/splitLayout';
import { ImageView, type ImageViewProps } from './ImageView';
import { ProfilePlot } from './ProfilePlot';
import { SplitBar } from './SplitBar';
import { StraightView } from './StraightView';

/** Props of the embryo view: the image panel's, plus the load error and whether the tab is hidden. */
export interface EmbryoViewProps extends ImageViewProps {
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
      <ImageView {...p} />
      <SplitBar fraction={fraction} onFraction={setFraction} totalPx={size.height} />
      <div className="profile-pane" style={{ height: paneH }}>
        <StraightView measurement={p.measurement} display={p.state.display} width={width} fitRangeEl={p.fitRangeEl} height={stripPx} />
        <ProfilePlot measurement={p.measurement} width={width} height={plotPx} fitRangeEl={p.fitRangeEl} dispatch={p.dispatch} />
      </div>
    </div>
  );
}
