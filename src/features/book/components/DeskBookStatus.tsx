/**
 * A desk book's standing: its set, sync state and last writer; a note when the user may only
 * read it; the service's refusal; and a conflict with the legs that differ and three ways out.
 */
import { ConflictChoices } from '../../../components/ConflictChoices';
import { SyncBadge } from '../../../components/SyncBadge';
import type { BookDocument, Position } from '../../../engine/book';
import type { OpenBook, Resolution } from '../hooks/use-book-source';

/** Legs only in mine, only in theirs, and in both with other terms, by leg id. */
function legDifferences(mine: Position[], theirs: Position[]) {
  const byId = new Map(theirs.map((p) => [p.id, p]));
  const ids = new Set(mine.map((p) => p.id));
  return {
    onlyMine: mine.filter((p) => !byId.has(p.id)).map((p) => p.id),
    onlyTheirs: theirs.filter((p) => !ids.has(p.id)).map((p) => p.id),
    changed: mine
      .filter((p) => byId.has(p.id) && JSON.stringify(byId.get(p.id)) !== JSON.stringify(p))
      .map((p) => p.id),
  };
}

const list = (ids: string[]) =>
  ids.length === 0 ? 'none' : ids.slice(0, 12).join(', ') + (ids.length > 12 ? ' …' : '');

export function DeskBookStatus({
  book,
  onResolve,
  resolving,
}: {
  book: OpenBook;
  onResolve: (how: Resolution) => void;
  resolving: boolean;
}) {
  const synced = book.synced;
  if (!synced || !book.set) return null;
  const conflict = synced.conflict;
  const theirs = conflict?.document as BookDocument | null | undefined;
  const diff = theirs ? legDifferences(synced.document.positions, theirs.positions) : null;
  return (
    <div className="space-y-2 text-sm" data-testid="desk-book-status">
      <p className="flex flex-wrap items-center gap-2 text-muted">
        <SyncBadge s={synced} />
        <span>
          Shared in the desk set {book.set.name}
          {synced.revision > 0 && ` · revision ${synced.revision}`}
          {synced.updatedBy && ` by ${synced.updatedBy}`}
        </span>
      </p>
      {!book.editable && (
        <p role="note" className="text-muted">
          You can read this book; leads and traders of the desk edit it.
        </p>
      )}
      {synced.syncError && (
        <p role="alert" className="text-stressed">
          The service refused the last change: {synced.syncError}
        </p>
      )}
      {conflict && (
        <div
          className="space-y-2 rounded-md border border-stressed/40 bg-stressed/5 p-3"
          data-testid="book-conflict"
        >
          <p>
            {conflict.deleted || !theirs
              ? 'Someone deleted this book on the service while you edited it here.'
              : `The service has revision ${conflict.revision}, written while you edited this book here.`}
          </p>
          {diff && (
            <ul className="tabular list-inside list-disc text-xs">
              <li>legs only in mine: {list(diff.onlyMine)}</li>
              <li>legs only in theirs: {list(diff.onlyTheirs)}</li>
              <li>legs in both with other terms: {list(diff.changed)}</li>
              {theirs && theirs.name !== synced.document.name && (
                <li>
                  name: mine “{synced.document.name}”, theirs “{theirs.name}”
                </li>
              )}
            </ul>
          )}
          <ConflictChoices onResolve={onResolve} disabled={resolving} />
        </div>
      )}
    </div>
  );
}
