import { useEffect, useRef, useState } from 'react';
import { RichTextEditor } from '../../../components/ui/rich-text-editor';
import { useUnitZone } from '../../../components/station-time/use-station-zone';
import { formatStationTime } from '../../../../shared/station-time';
import { ApiError } from '../../../lib/api-client';
import { saveNotes, type Board } from '../api/handover';

/** Draft notes, saved a moment after typing stops; a clash with another writer keeps both texts. */
export function HandoverNotes({ board, editable }: { board: Board; editable: boolean }) {
  const h = board.handover;
  const timeZone = useUnitZone(h.unitId)?.timeZone;
  const version = useRef(h.notesVersion);
  const [html, setHtml] = useState(h.notesHtml);
  const [dirty, setDirty] = useState(false);
  const [status, setStatus] = useState<string>('');
  const [conflict, setConflict] = useState<string | null>(null);
  const [editorKey, setEditorKey] = useState(0);

  // Someone else saved and we have nothing unsaved: show their text.
  useEffect(() => {
    if (!dirty && h.notesVersion > version.current) {
      version.current = h.notesVersion;
      setHtml(h.notesHtml);
      setEditorKey((k) => k + 1);
    }
  }, [h.notesVersion, h.notesHtml, dirty]);

  useEffect(() => {
    if (!dirty || conflict !== null) return;
    const timer = setTimeout(() => {
      saveNotes(h.id, html, version.current)
        .then((r) => {
          version.current = r.version;
          setDirty(false);
          setStatus(timeZone ? `Draft saved ${formatStationTime(new Date(), timeZone, 'time-seconds')} (station time)` : 'Draft saved');
        })
        .catch((error: unknown) => {
          if (error instanceof ApiError && error.status === 409 && error.code === 'NOTES_CONFLICT') setConflict(error.message);
          else setStatus(error instanceof Error ? `Not saved: ${error.message}` : 'Not saved');
        });
    }, 1200);
    return () => clearTimeout(timer);
  }, [dirty, html, h.id, conflict, timeZone]);

  if (!editable) {
    return <div className="order-body rounded-md border border-line bg-panel p-3" data-testid="handover-notes" dangerouslySetInnerHTML={{ __html: h.notesHtml || '<p><em>No notes.</em></p>' }} />;
  }
  return (
    <div className="flex flex-col gap-2">
      <RichTextEditor
        key={editorKey}
        label="Handover notes"
        initialHtml={html}
        onChange={(next) => {
          setHtml(next);
          setDirty(true);
        }}
      />
      <p className="text-sm text-muted" aria-live="polite">
        {dirty ? 'Unsaved changes…' : status}
      </p>
      {conflict ? (
        <div role="alert" className="rounded-md border-2 border-alarm bg-panel p-2 text-sm">
          <p className="font-bold">⛔ {conflict}</p>
          <p className="mt-1">Their text, as saved:</p>
          <div className="order-body border-l-4 border-line pl-2" dangerouslySetInnerHTML={{ __html: h.notesHtml }} />
          <p className="mt-1">Your text stays in the editor above.</p>
          <button
            type="button"
            className="mt-1 rounded-md bg-accent px-3 py-1 font-bold text-on-accent"
            onClick={() => {
              version.current = h.notesVersion;
              setConflict(null);
            }}
          >
            Save my text over theirs
          </button>
        </div>
      ) : null}
    </div>
  );
}
