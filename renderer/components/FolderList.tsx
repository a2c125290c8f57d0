// The open folder's files with their status; click or PageUp/PageDown to move between them.
import type { FolderEntry } from '../../core/contract';

/** Status shown for an entry: error (listing or last batch) first, then 'edited' when the project holds hand edits, then 'analysed' after a batch. */
export function entryStatus(e: FolderEntry, hasEdits: boolean, batch?: 'ok' | 'error'): FolderEntry['status'] {
  if (e.status === 'error' || batch === 'error') return 'error';
  if (hasEdits) return 'edited';
  return batch === 'ok' ? 'analysed' : e.status;
}

/** Props of the folder list. */
export interface FolderListProps {
  readonly folder: string | null;
  readonly entries: readonly FolderEntry[];
  readonly current: string | null;
  readonly edited: (name: string) => boolean;
  /** Outcome of each file in the last batch, with its message. */
  readonly batchOutcome: (name: string) => { status: 'ok' | 'error'; message: string | null } | undefined;
  readonly onSelect: (name: string) => void;
}

/** The file list. */
export function FolderList({ folder, entries, current, edited, batchOutcome, onSelect }: FolderListProps) {
  return (
    <section className="panel folder-list" data-testid="folder-list">
      <h3 title={folder ?? ''}>Files <span className="muted">{entries.length} · PgUp/PgDn</span></h3>
      <ul>
        {entries.map((e) => {
          const outcome = batchOutcome(e.name);
          const status = entryStatus(e, edited(e.name), outcome?.status);
          return (
            <li key={e.path} className={e.name === current ? 'current' : ''} data-testid="folder-entry" data-name={e.name} data-status={status}>
              <button onClick={() => onSelect(e.name)} title={e.message ?? outcome?.message ?? e.path} aria-current={e.name === current ? 'true' : undefined}>
                <span className={`status status-${status}`}>{status}</span><span className="fname">{e.name}</span>
              </button>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
