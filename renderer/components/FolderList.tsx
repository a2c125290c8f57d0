// The open folder's files with their status; click or PageUp/PageDown to move between them.
import type { FolderEntry } from '../../core/contract';

/** Status shown for an entry: 'edited' when the project holds hand edits for it (unless it failed). */
export function entryStatus(e: FolderEntry, hasEdits: boolean): FolderEntry['status'] {
  if (e.status === 'error') return 'error';
  return hasEdits ? 'edited' : e.status;
}

/** Props of the folder list. */
export interface FolderListProps {
  readonly folder: string | null;
  readonly entries: readonly FolderEntry[];
  readonly current: string | null;
  readonly edited: (name: string) => boolean;
  readonly onSelect: (name: string) => void;
}

/** The file list. */
export function FolderList({ folder, entries, current, edited, onSelect }: FolderListProps) {
  return (
    <section className="panel folder-list" data-testid="folder-list">
      <h3 title={folder ?? ''}>Files <span className="muted">{entries.length} · PgUp/PgDn</span></h3>
      <ul>
        {entries.map((e) => {
          const status = entryStatus(e, edited(e.name));
          return (
            <li key={e.path} className={e.name === current ? 'current' : ''} onClick={() => onSelect(e.name)} title={e.message ?? e.path} data-testid="folder-entry">
              <span className={`status status-${status}`}>{status}</span><span className="fname">{e.name}</span>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
