// The image panel: canvas + overlays, pointer tools, wheel zoom, scale bar and the value under the cursor.
import { useEffect, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import type { Dispatch } from 'react';
import type { ApAxis, ImagePoint, Plane } from '../../core/model';
import { axisFraction } from '../../core/geometry';
import { chooseScaleBar, fitToWindow, pixelUnder, screenPt, screenToImage, zoomAt } from '../geometry';
import type { ScreenPt } from '../geometry';
import type { LiveMeasurement } from '../live';
import type { EditorAction, EditorState } from '../state';
import { IDLE, pointerDown, pointerMove, pointerUp } from '../tools';
import type { Gesture } from '../tools';
import { useElementSize } from '../hooks/useElementSize';
import { fixed, fmt } from '../ui/format';
import { ImageCanvas } from './ImageCanvas';
import { ImageOverlay, type NudgeTarget, type OverlayVisibility } from '../overlay/ImageOverlay';
import { OverlayKey } from './OverlayKey';

/** Props of the image panel. */
export interface ImageViewProps {
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
  /** Bumped to ask for fit-to-window (new file, or the F key). */
  readonly fitRequest: number;
  readonly spaceHeld: boolean;
  readonly overlays: OverlayVisibility;
  readonly onOverlays: (v: OverlayVisibility) => void;
  /** Where the value under the cursor is shown (the status bar), so it never covers the image. */
  readonly readoutTarget: HTMLElement | null;
}

/** Screen position of a pointer event relative to the element. */
const localPt = (e: { clientX: number; clientY: number }, el: HTMLElement): ScreenPt => {
  const r = el.getBoundingClientRect();
  return screenPt(e.clientX - r.left, e.clientY - r.top);
};

/** The image panel. */
export function ImageView(props: ImageViewProps) {
  const { state, dispatch, planes, measurement, axis } = props;
  const box = useRef<HTMLDivElement>(null);
  const size = useElementSize(box);
  const gesture = useRef<Gesture>(IDLE);
  const stateRef = useRef(state);
  stateRef.current = state;
  const [cursor, setCursor] = useState<ScreenPt | null>(null);
  const first = planes[0];

  // Fit on request (new file, F key) and keep fitting while the panel resizes, until the user zooms or pans.
  const lastFit = useRef<EditorState['view'] | null>(null);
  const fitNow = () => {
    if (first === undefined || size.width === 0 || size.height === 0) return;
    const view = fitToWindow(first.width, first.height, size.width, size.height);
    lastFit.current = view;
    dispatch({ type: 'setView', view });
  };
  useEffect(fitNow, [props.fitRequest, first?.width, first?.height]);
  useEffect(() => { if (lastFit.current === null || lastFit.current === stateRef.current.view) fitNow(); }, [size.width, size.height]);

  useEffect(() => {
    const el = box.current;
    if (el === null) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      dispatch({ type: 'setView', view: zoomAt(stateRef.current.view, localPt(e, el), Math.pow(1.0015, -e.deltaY)) });
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, [dispatch]);

  const run = (step: { gesture: Gesture; actions: readonly EditorAction[] }) => {
    gesture.current = step.gesture;
    step.actions.forEach(dispatch);
  };
  const input = (e: React.PointerEvent) => {
    const screen = localPt(e, e.currentTarget as HTMLElement);
    return { state: stateRef.current, screen, image: screenToImage(stateRef.current.view, screen), spaceHeld: props.spaceHeld };
  };
  // Keyboard moves of a focused handle or landmark: screen px → image px at the current zoom; held keys coalesce in undo.
  const nudge = (target: NudgeTarget, dxPx: number, dyPx: number, repeat: boolean) => {
    const s = stateRef.current;
    const dx = dxPx / s.view.zoom, dy = dyPx / s.view.zoom;
    if (target.kind === 'handle') {
      if (axis === null) return;
      const p = axis[target.end];
      dispatch({ type: 'setAxisHandle', end: target.end, point: { x: p.x + dx, y: p.y + dy }, coalesce: repeat });
    } else {
      const l = measurement?.landmarks[target.index];
      if (l === undefined) return;
      dispatch({ type: 'selectLandmark', index: target.index });
      dispatch({ type: 'moveLandmark', index: target.index, point: { x: l.point.x + dx, y: l.point.y + dy }, coalesce: repeat });
    }
  };
  const toolClass = props.spaceHeld || state.tool === 'pan' ? 'tool-pan' : `tool-${state.tool}`;

  return (
    <div ref={box} className={`image-view ${toolClass}`} data-testid="image-view" aria-label="image with overlays; keys: S swap poles, F fit, + and − zoom, L landmark tool"
      onPointerDown={(e) => { if (e.button !== 0) return; e.currentTarget.setPointerCapture(e.pointerId); run(pointerDown(gesture.current, input(e))); }}
      onPointerMove={(e) => { setCursor(localPt(e, e.currentTarget)); if (gesture.current.kind !== 'idle') run(pointerMove(gesture.current, input(e))); }}
      onPointerUp={() => run(pointerUp(gesture.current))}
      onPointerCancel={() => run(pointerUp(gesture.current))}
      onPointerLeave={() => setCursor(null)}>
      <ImageCanvas planes={planes} display={state.display} view={state.view} width={size.width} height={size.height} />
      <ImageOverlay view={state.view} width={size.width} height={size.height} outline={props.outline} axis={axis}
        measurement={measurement} bandOutlines={props.bandOutlines} fitRangeEl={props.fitRangeEl} halfWidthPx={props.halfWidthPx} selectedLandmark={state.selectedLandmark} visible={props.overlays} onKeyNudge={nudge} />
      <OverlayKey visible={props.overlays} onChange={props.onOverlays} />
      <ScaleBar pixelSizeUm={props.pixelSizeUm} zoom={state.view.zoom} />
      {props.readoutTarget !== null && createPortal(<Readout cursor={cursor} state={state} planes={planes} names={props.channelNames} axis={axis} pixelSizeUm={props.pixelSizeUm} />, props.readoutTarget)}
      {first === undefined && <div className="image-empty">No image</div>}
    </div>
  );
}

/** A round-length scale bar in µm (or a note when the pixel size is unknown). */
function ScaleBar({ pixelSizeUm, zoom }: { pixelSizeUm: number | null; zoom: number }) {
  const bar = pixelSizeUm === null ? null : chooseScaleBar(pixelSizeUm, zoom, 160);
  if (bar === null) return <div className="scale-bar muted">pixel size unknown</div>;
  return (
    <div className="scale-bar" data-testid="scale-bar">
      <div className="scale-bar-line" style={{ width: bar.screenPx }} />
      <span>{bar.lengthUm} µm</span>
    </div>
  );
}

/** Pixel position and values under the cursor, and its x/EL along the axis. */
function Readout({ cursor, state, planes, names, axis, pixelSizeUm }: { cursor: ScreenPt | null; state: EditorState; planes: readonly Plane[]; names: readonly string[]; axis: ApAxis | null; pixelSizeUm: number | null }) {
  const first = planes[0];
  if (cursor === null || first === undefined) return null;
  const img = screenToImage(state.view, cursor);
  const px = pixelUnder(img, first.width, first.height);
  if (px === null) return null;
  const k = px.row * first.width + px.col;
  const xEl = axis === null ? null : axisFraction(axis, img);
  const um = pixelSizeUm === null ? '' : ` (${fixed(px.col * pixelSizeUm, 1)}, ${fixed(px.row * pixelSizeUm, 1)} µm)`;
  return (
    <div className="readout" data-testid="readout">
      x {px.col}, y {px.row}{um}
      {planes.map((p, i) => <span key={i}> · {names[i] ?? `c${i + 1}`} {fmt(p.data[k], 4)}</span>)}
      {xEl !== null && <span> · {fixed(xEl, 3)} EL</span>}
    </div>
  );
}
