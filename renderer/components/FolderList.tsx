// The open folder's files with their status (a text label beside the colour; the reason on hover); click, Enter or
// PageUp/PageDown to move between them.
import type { FolderEntry } from '../../core/contract';
import type { FileStatus } from '../state/fileStatus';

/** Props of the folder list. */
export interface FolderListProps {
  readonly folder: string | null;
  readonly entries: readonly FolderEntry[];
  readonly current: string | null;
  /** Status of each file (see state/fileStatus). */
  readonly status: (entry: FolderEntry) => FileStatus;
  /** True when the project holds hand edits for the file (marked ✎). */
  readonly handEdited: (name: string) => boolean;
  readonly onSelect: (name: string) => void;
}

/** The file list. */
export function FolderList({ folder, entries, current, status, handEdited, onSelect }: FolderListProps) {
  return (
    <section className="panel folder-list" data-testid="folder-list">
      <h3 title={folder ?? ''}>Files <span className="muted">{entries.length} · PgUp/PgDn</span></h3>
      <ul aria-label="files of the folder">
        {entries.map((e) => {
          const s = status(e);
          return (
            <li key={e.path} className={e.name === current ? 'current' : ''} data-testid="folder-entry" data-name={e.name} data-status={s.state}>
              <button onClick={() => onSelect(e.name)} title={`${e.name}: ${s.label} — ${s.reason}`} aria-current={e.name === current ? 'true' : undefined}>
                <span className={`status status-${s.state}`}>{s.label}</span><span className="fname">{e.name}</span>
                {handEdited(e.name) && <span className="hand-edited" title="hand edits (axis, landmarks or fit range) saved in the project">✎</span>}
              </button>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
