// Keyboard and mouse reference, shown with F1 or ? (and the Help menu).

const ROWS: [string, string][] = [
  ['drag A / P handle', 'move the anterior or posterior pole (axis tool)'],
  ['S', 'swap anterior and posterior'],
  ['L, then click', 'place a landmark; drag it to move; Del removes the selected one'],
  ['H / A / L', 'pan, axis and landmark tools'],
  ['Space + drag', 'pan with any tool'],
  ['wheel, + / −', 'zoom at the pointer / at the centre'],
  ['F or 0', 'fit the image to the window'],
  ['drag the yellow lines', 'change the fit range on the profile'],
  ['PgDn / PgUp or ] / [', 'next / previous file'],
  ['Ctrl+Z, Ctrl+Shift+Z', "undo, redo (the settings, the comparison options and the shown file's hand edits; other files are never changed)"],
  ['Ctrl+S', 'save now (edits also save themselves)'],
  ['Tab, then arrows', 'a focused A/P handle or landmark moves 1 px (Shift: 10 px); a focused fit-range line moves 0.01 EL (Shift: 0.05)'],
  ['Tab, then arrows, Home, End', 'a focused histogram handle moves the display range 1% of the data range (Shift: 10%); Home and End go to its ends'],
  ['Tab to the bar under the image, ↑ / ↓', 'give the image or the profile more room (or drag the bar)'],
  ['Enter on a batch row', 'show that embryo with its status and warnings'],
  ['Over time: ← / →, Shift+← / →', 'previous / next time point (five with Shift); Home and End go to the first and last'],
  ['Over time: Space', 'play or pause the movie'],
];

/** The help overlay; click anywhere to close. */
export function Help({ onClose }: { onClose: () => void }) {
  return (
    <div className="help" data-testid="help" onClick={onClose}>
      <div className="help-card">
        <h3>Eggline: keys and gestures</h3>
        <table><tbody>{ROWS.map(([k, v]) => <tr key={k}><th>{k}</th><td>{v}</td></tr>)}</tbody></table>
        <p className="muted">Positions along the axis are x/EL: 0 at the anterior pole, 1 at the posterior pole. λ is the decay length of A·e^(−x/λ)+B fitted over the fit range.</p>
      </div>
    </div>
  );
}
