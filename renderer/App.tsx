// The editor window: file list and settings on the left, image over straightened strip over profile in the middle,
// numbers, display and landmarks on the right; batch and cohort views as tabs.
import { useCallback, useEffect, useMemo, useReducer, useRef, useState } from 'react';
import { MENU_OPEN_RECENT_PREFIX } from '../core/contract';
import type { Plane } from '../core/model';
import { getApi } from './api';
import { BatchPanel } from './components/BatchPanel';
import { ChannelPanel } from './components/ChannelPanel';
import { CohortView } from './components/CohortView';
import { FitNumbers } from './components/FitNumbers';
import { FolderList } from './components/FolderList';
import { EmbryoView } from './components/EmbryoView';
import { ALL_OVERLAYS } from './overlay/ImageOverlay';
import { LandmarkList } from './components/LandmarkList';
import { SettingsPanel } from './components/SettingsPanel';
import { Toolbar, type Tab } from './components/Toolbar';
import { screenPt, zoomAt } from './geometry';
import { toProjectDoc, useAutosave } from './hooks/useAutosave';
import { useBatch } from './hooks/useBatch';
import { useElementSize } from './hooks/useElementSize';
import type { KeyCommand } from './hooks/useKeys';
import { useCommandInput } from './hooks/useCommandInput';
import { Help } from './components/Help';
import { useSession } from './hooks/useSession';
import { useStackLoader } from './hooks/useStackLoader';
import { useExports } from './hooks/useExports';
import { useLiveMeasurement } from './hooks/useLiveMeasurement';
import { movieViewOf, useMovie } from './hooks/useMovie';
import { TimelapseView } from './components/timelapse/TimelapseView';
import type { FolderEntry, LoadedStack, ProjectCohortOptions } from '../core/contract';
import { fileStatus } from './state/fileStatus';
import { currentEdits, editorReducer, fileResult, initialState, storedEdits, timePointEdits } from './state';
import { fileEditsAt, timePointForFile } from '../core/settings';
import { TimePointPanel, shownTimeText } from './components/TimePointPanel';
import { useSettled } from './hooks/useSettled';
import { autoDisplayRange, CHANNEL_COLOURS } from './view';

export type { Tab } from './components/Toolbar';

/** The whole window. */
export function App() {
  const api = useMemo(getApi, []);
  const [state, dispatch] = useReducer(editorReducer, undefined, initialState);
  const [tab, setTab] = useState<Tab>('embryo');
  const [fitRequest, setFitRequest] = useState(0);
  const [spaceHeld, setSpaceHeld] = useState(false);
  const [zSlice, setZSlice] = useState<number | null>(null);
  const [slicePlanes, setSlicePlanes] = useState<Plane[] | null>(null);
  // Selecting the file already shown changes nothing: its stack stays loaded, so dropping its automatic axis (as a
  // newly selected file does until its stack arrives) would leave it without one.
  const shownName = useRef<string | null>(null);
  shownName.current = state.current;
  const select = useCallback((name: string | null) => {
    if (name !== null && name !== shownName.current) { dispatch({ type: 'selectFile', key: name, autoAxis: null }); setZSlice(null); }
  }, []);
  const flushSave = useRef<() => Promise<void>>(async () => undefined);
  const { session, openDemo, openFolder, openProject, openFiles, openRecent, openAtStart, openDroppedFiles, setMessage, setBatchOutDir } = useSession(api, dispatch, select, () => flushSave.current());
  const [help, setHelp] = useState(false);
  const [exportMenu, setExportMenu] = useState(false);
  const [overlays, setOverlays] = useState(ALL_OVERLAYS);
  const [readoutTarget, setReadoutTarget] = useState<HTMLElement | null>(null);
  const entry = session.entries.find((e) => e.name === state.current) ?? null;
  const { movie, analyse: analyseMovie, cancel: cancelMovie, options: movieOptions, setOptions: setMovieOptions } = useMovie(api);
  const movieView = movieViewOf(movie, entry?.name ?? null);
  // The Over time tab shows the analysed time points only: there, a shown time point that was not analysed moves to
  // the nearest analysed one (the Embryo view shows any time point).
  useEffect(() => {
    const t = state.shownTimeIndex;
    if (tab !== 'time' || movieView === null || movieView.timeIndices.length === 0 || movieView.timeIndices.includes(t)) return;
    const nearest = movieView.timeIndices.reduce((a, b) => (Math.abs(b - t) < Math.abs(a - t) ? b : a));
    dispatch({ type: 'showTimePoint', tIndex: nearest });
  }, [movieView, tab, state.shownTimeIndex]);
  // The Embryo view loads the shown time point once it rests for a moment (not every frame while the movie plays or
  // the slider is dragged; the app stops a load the window no longer wants), reading the file's time points as the
  // batch does: with the file's time step a plain multi-page file is read as frames, and a movie's embryo is found once
  // over time unless it is found at every time point.
  const restingT = useSettled(state.shownTimeIndex, 250);
  const storedTimeStepS = (entry === null ? undefined : state.doc.files[entry.name]?.timeStepS) ?? null;
  const loadTime = useMemo(() => ({ timeStepS: storedTimeStepS, axisPerTime: movieOptions.axisPerTime }), [storedTimeStepS, movieOptions.axisPerTime]);
  const loadSettings = useMemo(() => (restingT === state.doc.settings.timeIndex ? state.doc.settings : { ...state.doc.settings, timeIndex: restingT }), [state.doc.settings, restingT]);
  const load = useStackLoader(api, entry?.path ?? null, loadSettings, loadTime);
  // Until the shown file's stack arrives, show nothing rather than its edits over the previous image.
  const stack = load.stack !== null && load.stack.path === entry?.path ? load.stack : null;
  const isMovie = stack !== null && stack.info.sizeT > 1;
  const { loading, error: loadError } = load;
  // The first picture while the stack loads: one raw slice, replaced by the projection when the stack arrives.
  const preview = stack === null && load.preview !== null && load.preview.path === entry?.path ? load.preview.plane : null;
  const [saveStatus, saveNow] = useAutosave(api, session.projectPath, session.folder, state.doc, state.revision, session.batchOutDir);
  flushSave.current = () => (saveStatus.kind === 'pending' ? saveNow() : Promise.resolve());
  const { batch, results, chooseOutput, run, cancel, restore, recomputeCohort } = useBatch(api);
  // The project's last batch comes back with the project (results.json in the output folder it records), compared with
  // the project's cohort options.
  useEffect(() => { void restore(session.batchOutDir, session.folder, state.doc.cohort ?? null); }, [session.projectPath, session.folder]);
  // A comparison option: an undoable project edit, saved (autosave); after it, or its undo or redo, the cohort is
  // recomputed with the options then in force, in the main process.
  const setCohortOptions = (cohort: ProjectCohortOptions) => dispatch({ type: 'setCohortOptions', cohort });
  useEffect(() => { if (state.cohortRevision > 0) void recomputeCohort(session.folder, state.doc.cohort ?? {}); }, [state.cohortRevision]);
  // A finished batch's output folder is written into the project at once, so its results reopen after a restart.
  const [outDirSaves, setOutDirSaves] = useState(0);
  useEffect(() => { if (outDirSaves > 0) void saveNow(); }, [outDirSaves]);
  const runBatchNow = async () => {
    if (session.folder === null) return;
    const out = await run(session.folder, toProjectDoc(state.doc, session.folder, session.batchOutDir));
    if (out !== null && session.projectPath !== null) { setBatchOutDir(out); setOutDirSaves((n) => n + 1); }
  };
  // Files that failed to load this session, with the reason (shown as their status until they load).
  const [loadErrors, setLoadErrors] = useState<Readonly<Record<string, string>>>({});
  useEffect(() => {
    const name = state.current;
    if (name === null || loading) return;
    if (loadError) setLoadErrors((m) => ({ ...m, [name]: loadError }));
    else if (stack !== null && loadErrors[name] !== undefined) setLoadErrors((m) => { const { [name]: _gone, ...rest } = m; return rest; });
  }, [loadError, loading, stack, state.current]);
  // A file's result at the shown time point (t = 0 unless a movie's time point is chosen); a file with one time point has only t = 0.
  const resultFor = (name: string | null) => (name === null ? undefined : fileResult(results, name, name === state.current ? state.shownTimeIndex : 0));
  const statusOf = (e: FolderEntry) => fileStatus(e, fileEditsAt(state.doc.files[e.name], e.name === state.current ? state.shownTimeIndex : 0) ?? undefined, resultFor(e.name), loadErrors[e.name] ?? null);
  const openReport = async (path: string) => {
    if (api === null) return;
    const r = await api.openReport(path);
    if (!r.ok) setMessage(r.error.message);
  };
  const openFromBatch = (name: string) => { select(name); setTab('embryo'); };
  const centre = useRef<HTMLDivElement>(null);
  const centreSize = useElementSize(centre);
  const zoomBy = (factor: number) => dispatch({ type: 'setView', view: zoomAt(stateRef.current.view, screenPt(centreSize.width / 2, 200), factor) });

  useEffect(() => { void openAtStart(); }, []);

  // A newly loaded stack brings its automatic axis, display ranges fitted to it, and the image fitted to the window;
  // another time point of the same file keeps the view where it is, and the movie's embryo arriving for the stack
  // already shown changes only the automatic axis.
  const shownLoad = useRef<{ loaded: LoadedStack; path: string; t: number | null } | null>(null);
  useEffect(() => {
    if (stack === null || state.current === null || load.stack === null) return;
    dispatch({ type: 'selectFile', key: state.current, autoAxis: stack.detection.axis });
    const before = shownLoad.current;
    if (before !== null && before.loaded === load.stack) return;
    shownLoad.current = { loaded: load.stack, path: stack.path, t: load.timeIndex };
    dispatch({ type: 'initChannelDisplay', channels: stack.projected.channels.map((p, i) => {
      const [low, high] = autoDisplayRange(p);
      return { colour: CHANNEL_COLOURS[i % CHANNEL_COLOURS.length], low, high };
    }) });
    if (before === null || before.path !== stack.path || before.t === load.timeIndex) setFitRequest((n) => n + 1);
  }, [stack]);

  // The preview gets a display range of its own and is fitted to the window like a loaded stack.
  useEffect(() => {
    if (preview === null) return;
    const [low, high] = autoDisplayRange(preview);
    dispatch({ type: 'initChannelDisplay', channels: [{ colour: CHANNEL_COLOURS[0], low, high }] });
    setFitRequest((n) => n + 1);
  }, [preview]);

  useEffect(() => {
    if (api === null || stack === null || zSlice === null) { setSlicePlanes(null); return; }
    let live = true;
    Promise.all(stack.projected.channels.map((_, c) => api.loadSlice({ path: stack.path, z: zSlice, c, t: load.timeIndex ?? state.doc.settings.timeIndex }))).then((rs) => {
      if (!live) return;
      const bad = rs.find((r) => !r.ok);
      if (bad !== undefined && !bad.ok) { setMessage(bad.error.message); return; }
      setSlicePlanes(rs.map((r) => (r.ok ? r.value : { width: 0, height: 0, data: new Float32Array(0) })));
    }, (e: unknown) => setMessage(String(e)));
    return () => { live = false; };
  }, [api, stack, zSlice]);

  const edits = currentEdits(state);
  const stored = storedEdits(state);
  // What an analysis over time is made from: the settings, this file's stored edits (every time point's), the options.
  const movieBasis = JSON.stringify([state.doc.settings, entry === null ? null : state.doc.files[entry.name] ?? null, movieOptions]);
  const movieRequest = { ...movieOptions, timeStepS: stored.timeStepS ?? null };
  const startMovie = () => { if (entry !== null) void analyseMovie(entry.path, entry.name, toProjectDoc(state.doc, session.folder, session.batchOutDir), movieRequest, movieBasis); };
  // New time points or a new time step for the shown movie analyse it again (cancelling a run under way).
  const movieTimeKey = JSON.stringify([state.current, stored.time ?? null, stored.timeStepS ?? null]);
  const lastMovieTime = useRef(movieTimeKey);
  useEffect(() => {
    const before = lastMovieTime.current;
    lastMovieTime.current = movieTimeKey;
    if (before === movieTimeKey || entry === null || (JSON.parse(before) as unknown[])[0] !== entry.name) return;
    if (movie.file === entry.name && (movie.view !== null || movie.status === 'running')) startMovie();
  }, [movieTimeKey]);
  const embryoLoading = stack !== null && isMovie && load.timeIndex !== state.shownTimeIndex;
  // The settings' time point in this file: a file with fewer time points shows its last (a single stack its only
  // one), as the batch analyses it, with the batch's warning.
  const sharedTimePoint = stack === null || entry === null ? null : timePointForFile(state.doc.settings.timeIndex, stack.info.sizeT, entry.name);
  useEffect(() => {
    if (stack !== null && state.shownTimeIndex > stack.info.sizeT - 1) dispatch({ type: 'showTimePoint', tIndex: stack.info.sizeT - 1 });
  }, [stack, state.shownTimeIndex]);
  const { settings, axis, fitRangeEl, measurement, bandOutlines, pixelSizeUm, halfWidthPx } = useLiveMeasurement(stack, state);
  const planes = slicePlanes ?? stack?.projected.channels ?? (preview === null ? [] : [preview]);
  const names = stack?.projected.channelNames ?? (preview === null ? [] : ['C1']);
  const exports = useExports(api, { state, stack, measurement, bandOutlines, axis, entryName: state.current, setMessage, planes });

  const step = (d: number) => {
    const i = session.entries.findIndex((e) => e.name === state.current);
    const next = session.entries[i + d];
    if (next !== undefined) select(next.name);
  };

  const stateRef = useRef(state);
  stateRef.current = state;
  /** Run a keyboard or menu command against the latest state. */
  const runCommand = (cmd: KeyCommand | string) => {
    const s = stateRef.current;
    switch (cmd) {
      case 'undo': case 'redo': dispatch({ type: cmd }); break;
      case 'save': void saveNow(); break;
      case 'swap': case 'swap-poles': dispatch({ type: 'swapPoles' }); break;
      case 'fit': case 'fit-to-window': setFitRequest((n) => n + 1); break;
      case 'zoom-in': zoomBy(1.25); break;
      case 'zoom-out': zoomBy(0.8); break;
      case 'delete': if (s.selectedLandmark !== null) dispatch({ type: 'deleteLandmark', index: s.selectedLandmark }); break;
      case 'next-file': step(1); break;
      case 'prev-file': step(-1); break;
      case 'tool-pan': dispatch({ type: 'setTool', tool: 'pan' }); break;
      case 'tool-axis': dispatch({ type: 'setTool', tool: 'axis' }); break;
      case 'tool-landmark': dispatch({ type: 'setTool', tool: 'landmark' }); break;
      case 'help': case 'show-help': setHelp((v) => !v); break;
      case 'open-folder': void openFolder(); break;
      case 'open-files': void openFiles(); break;
      case 'open-project': void openProject(); break;
      case 'open-demo': void openDemo(); break;
      case 'export': setTab('embryo'); setExportMenu(true); break;
      default:
        if (cmd.startsWith(MENU_OPEN_RECENT_PREFIX)) void openRecent(cmd.slice(MENU_OPEN_RECENT_PREFIX.length));
    }
  };
  useCommandInput(api, runCommand, setSpaceHeld);

  if (api === null) return <div className="fatal">This page must run inside Eggline: the app connection (window.eggline) is missing.</div>;
  const message = session.message ?? (saveStatus.kind === 'error' ? `Not saved: ${saveStatus.message}` : null);

  return (
    <div className="app"
      onDragOver={(e) => { if (e.dataTransfer.types.includes('Files')) e.preventDefault(); }}
      onDrop={(e) => { e.preventDefault(); void openDroppedFiles([...e.dataTransfer.files]); }}>
      <Toolbar state={state} dispatch={dispatch} tab={tab} onTab={setTab} onOpenFolder={openFolder} onOpenProject={openProject} onOpenDemo={openDemo}
        onFit={() => setFitRequest((n) => n + 1)} onZoom={zoomBy} saveStatus={saveStatus} exports={exports} hasMeasurement={measurement !== null}
        exportMenu={exportMenu} onExportMenu={setExportMenu} onHelp={() => setHelp(true)} />
      {help && <Help onClose={() => setHelp(false)} />}
      {message && (
        <div className="message" role="status">
          <span data-testid="message" title={message} onClick={() => setMessage(null)}>{message}</span>
          {session.message && <button className="close" aria-label="dismiss the message" onClick={() => setMessage(null)}>✕</button>}
        </div>
      )}
      <div className={tab === 'time' ? 'body wide-centre' : 'body'}>
        <aside className="left">
          <FolderList folder={session.folder} entries={session.entries} current={state.current} onSelect={select} status={statusOf}
            handEdited={(n) => { const f = state.doc.files[n]; return f !== undefined && (f.axis !== null || f.landmarks.length > 0 || f.fitRangeEl !== null || f.timePoints !== undefined); }} />
          <SettingsPanel settings={settings} channelNames={names} dispatch={dispatch} shownTimeIndex={state.shownTimeIndex} />
        </aside>
        <main className="centre" ref={centre}>
          <EmbryoView hidden={tab !== 'embryo'} state={state} dispatch={dispatch} planes={planes} channelNames={names} outline={stack?.detection.outline ?? []} axis={axis}
            measurement={measurement} bandOutlines={bandOutlines} fitRangeEl={fitRangeEl} pixelSizeUm={pixelSizeUm} halfWidthPx={halfWidthPx} fitRequest={fitRequest}
            spaceHeld={spaceHeld} overlays={overlays} onOverlays={setOverlays} readoutTarget={readoutTarget} loadError={loadError} />
          {tab === 'batch' && <BatchPanel batch={batch} folder={session.folder} fileCount={session.entries.length} onChooseOutput={chooseOutput}
            onRun={() => { void runBatchNow(); }} onCancel={cancel} onOpenFile={openFromBatch} onOpenReport={openReport} current={state.current} />}
          {tab === 'time' && <TimelapseView api={api} file={entry === null ? null : { name: entry.name, path: entry.path }} info={stack?.info ?? null} movie={movie}
            basis={movieBasis} options={movieOptions} onOptions={setMovieOptions}
            movieTime={{ time: stored.time ?? null, timeStepS: stored.timeStepS ?? null }}
            onMovieTime={(time, timeStepS) => dispatch({ type: 'setMovieTime', time, timeStepS })}
            onAnalyse={startMovie} onCancel={() => { void cancelMovie(); }}
            tIndex={state.shownTimeIndex} onTimePoint={(t) => dispatch({ type: 'showTimePoint', tIndex: t })} setMessage={setMessage} />}
          {tab === 'cohort' && <CohortView summary={batch.summary} onOpenReport={openReport}
            options={{ options: state.doc.cohort ?? {}, conditions: batch.sheetConditions, columns: batch.sheetColumns, busy: batch.recomputing, onChange: setCohortOptions }} />}
        </main>
        <aside className="right">
          {isMovie && stack !== null && <TimePointPanel tIndex={state.shownTimeIndex} sizeT={stack.info.sizeT}
            timeText={shownTimeText(movieView, stack.info, state.shownTimeIndex)} analysed={movieView?.timeIndices ?? []} loading={embryoLoading}
            scope={state.editScope} own={timePointEdits(state)} dispatch={dispatch} />}
          <FitNumbers m={measurement} pixelSizeUm={pixelSizeUm} loading={loading || session.opening} axisSource={axis?.source ?? null}
            file={entry === null ? null : { name: entry.name, status: statusOf(entry), result: resultFor(entry.name) ?? null }}
            timePointWarning={sharedTimePoint !== null && sharedTimePoint.tIndex === state.shownTimeIndex ? sharedTimePoint.warning : null}
            settingsFitRangeEl={edits.fitRangeEl === null ? null : settings.fitRangeEl}
            dorsal={state.doc.settings.profile.mode === 'edge' && state.doc.settings.profile.edgeSide !== 'both'
              ? { own: edits.dorsalSide ?? null, shared: state.doc.settings.profile.dorsalSide, onChange: (side) => dispatch({ type: 'setDorsalSide', side }) }
              : null} />
          <ChannelPanel state={state} dispatch={dispatch} planes={planes} names={names} sizeZ={stack?.info.sizeZ ?? 1} zSlice={zSlice} onZSlice={setZSlice} />
          <LandmarkList landmarks={measurement?.landmarks ?? []} selected={state.selectedLandmark} dispatch={dispatch} axis={axis} />
        </aside>
      </div>
      <footer className="statusbar">
        <span>{entry?.name ?? 'no file'}{isMovie && stack !== null ? ` · time point ${(load.timeIndex ?? 0) + 1} of ${stack.info.sizeT}` : ''}{axis ? ` · axis ${axis.source}` : ''}{preview === null ? '' : ` · slice ${preview.z + 1} of ${preview.sizeZ}, first channel: projecting…`}{edits.fitRangeEl ? ' · own fit range' : ''}</span>
        <span className="readout-slot" ref={setReadoutTarget} />
        <span className="muted keys-hint">drag A/P · S swap · L landmark · Del delete · Space+drag pan · wheel/± zoom · F fit · Ctrl+Z undo · F1 help</span>
      </footer>
    </div>
  );
}
