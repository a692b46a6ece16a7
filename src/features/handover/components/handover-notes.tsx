import { lazy, Suspense, useCallback, useEffect, useRef, useState, type HTMLAttributes } from 'react';
import { useBlocker } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { handoverKeys, saveNotes, type Board } from '../api/handover';
import { clearLocalDraft, readLocalDraft, writeLocalDraft } from '../lib/notes-draft';

// The editor's code (Tiptap, ~130 kB gzip) loads only when someone starts writing: readers, and writers
// who only look, get the stored HTML.
const loadEditor = () => import('../../../components/ui/rich-text-editor');
const RichTextEditor = lazy(async () => ({ default: (await loadEditor()).RichTextEditor }));

const AUTOSAVE_MS = 1200;

type Props = { board: Board; editable: boolean; stationTime: (iso: string) => string };

/**
 * Draft notes of ONE handover (the page keys this component by handover id, so switching units
 * never carries text across). Typed text is kept on the device at once and saved to the server a
 * moment after typing stops; a clash with another writer keeps both texts; leaving with text the
 * server does not have yet asks first.
 */
export function HandoverNotes({ board, editable, stationTime }: Props) {
  const h = board.handover;
  if (!editable) return <StoredNotes html={h.notesHtml} testId="handover-notes" />;
  return <NotesEditor board={board} stationTime={stationTime} />;
}

/**
 * The notes as stored. Setting the HTML directly is safe here: the server runs every save through
 * sanitizeRichText (server/lib/rich-text.ts, sanitize-html with an allow-list) before storing it, and
 * only ever returns what it stored, so no script or handler attribute can reach this element.
 */
function StoredNotes({ html, testId, ...box }: { html: string; testId: string } & HTMLAttributes<HTMLDivElement>) {
  return <div className="order-body rounded-md border border-line bg-panel p-3" data-testid={testId} {...box} dangerouslySetInnerHTML={{ __html: html || '<p><em>No notes.</em></p>' }} />;
}

function NotesEditor({ board, stationTime }: Omit<Props, 'editable'>) {
  const h = board.handover;
  const queryClient = useQueryClient();
  // What this browser had before: text from an earlier visit that never reached the server.
  const [restored] = useState(() => {
    const local = readLocalDraft(h.id);
    return local && local.html !== h.notesHtml ? local : null;
  });
  const version = useRef(restored ? restored.baseVersion : h.notesVersion);
  const [html, setHtml] = useState(restored?.html ?? h.notesHtml);
  const [dirty, setDirty] = useState(Boolean(restored));
  const [status, setStatus] = useState(restored ? `Restored text you typed at ${stationTime(restored.savedAt)} that had not been saved` : '');
  // The clash, and the version my save was based on: their text is shown once the board is newer.
  const [conflict, setConflict] = useState<{ message: string; myVersion: number } | null>(null);
  const [editorKey, setEditorKey] = useState(0);
  // Writing starts with a click on the notes (or "Edit notes"); text restored from this device opens the editor at once.
  const [writing, setWriting] = useState(Boolean(restored));
  const startWriting = () => {
    void loadEditor();
    setWriting(true);
  };
  // The text as typed, for a save that completes after more typing.
  const latest = useRef(html);

  // Someone else saved and we have nothing unsaved: show their text.
  useEffect(() => {
    if (!dirty && h.notesVersion > version.current) {
      version.current = h.notesVersion;
      latest.current = h.notesHtml;
      setHtml(h.notesHtml);
      setEditorKey((k) => k + 1);
    }
  }, [h.notesVersion, h.notesHtml, dirty]);

  const save = useCallback(async () => {
    const sent = latest.current;
    try {
      const r = await saveNotes(h.id, sent, version.current);
      version.current = r.version;
      if (latest.current === sent) {
        clearLocalDraft(h.id);
        setDirty(false);
      } else writeLocalDraft(h.id, latest.current, r.version);
      setStatus(`Draft saved at ${stationTime(new Date().toISOString())}`);
      return true;
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.code === 'NOTES_CONFLICT') {
        setConflict({ message: error.message, myVersion: version.current });
        // Their text may not have reached this tab yet (its live event still on the way): fetch the
        // board now, so what is shown as theirs, and the version overwritten, is what they saved.
        void queryClient.invalidateQueries({ queryKey: handoverKeys.unit(h.unitId) });
        void queryClient.invalidateQueries({ queryKey: handoverKeys.one(h.id) });
      }
      else setStatus(error instanceof Error ? `Not saved yet (kept on this device): ${error.message}` : 'Not saved yet (kept on this device)');
      return false;
    }
  }, [h.id, h.unitId, queryClient, stationTime]);

  useEffect(() => {
    if (!dirty || conflict !== null) return;
    const timer = setTimeout(() => void save(), AUTOSAVE_MS);
    return () => clearTimeout(timer);
  }, [dirty, html, conflict, save]);

  // Closing or reloading the tab with unsaved text: the browser asks (the text is on the device anyway).
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => {
      event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  // Leaving the page inside the app: save first; ask only if that fails.
  const blocker = useBlocker(dirty);
  const [leaveFailed, setLeaveFailed] = useState(false);
  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    const timer = setTimeout(() => {
      void save().then((saved) => {
        if (saved) blocker.proceed?.();
        else setLeaveFailed(true);
      });
    }, 0);
    return () => clearTimeout(timer);
  }, [blocker, save]);

  return (
    <div className="flex flex-col gap-2">
      {writing ? null : (
        <>
          <StoredNotes
            html={html}
            testId="handover-notes"
            role="textbox"
            aria-label="Handover notes"
            aria-readonly="true"
            aria-describedby="notes-edit-hint"
            tabIndex={0}
            onClick={startWriting}
            onKeyDown={(event) => {
              if (event.key === 'Enter' || event.key === ' ') {
                event.preventDefault();
                startWriting();
              }
            }}
          />
          <div className="flex items-center gap-2">
            <Button tone="plain" size="sm" onClick={startWriting}>
              Edit notes
            </Button>
            <span id="notes-edit-hint" className="text-sm text-muted">
              Click the notes or press Enter on them to write.
            </span>
          </div>
        </>
      )}
      {writing ? (
      <Suspense fallback={<p className="text-sm text-muted">Loading the editor…</p>}>
        <RichTextEditor
          key={editorKey}
          autofocus
          label="Handover notes"
          initialHtml={html}
          onChange={(next) => {
            latest.current = next;
            setHtml(next);
            setDirty(true);
            writeLocalDraft(h.id, next, version.current);
          }}
        />
      </Suspense>
      ) : null}
      <p className="text-sm text-muted" aria-live="polite" data-testid="notes-status">
        {dirty ? 'Unsaved changes (kept on this device)…' : status}
      </p>
      {blocker.state === 'blocked' && leaveFailed ? (
        <div role="alertdialog" aria-label="Unsaved notes" className="rounded-md border-2 border-watch bg-panel p-2 text-sm">
          <p className="font-bold">▲ Your latest notes have not reached the server yet.</p>
          <p>They stay on this device and come back when you open this handover again here.</p>
          <div className="mt-1 flex gap-2">
            <Button
              tone="plain"
              onClick={() => {
                setLeaveFailed(false);
                blocker.reset?.();
              }}
            >
              Stay on the handover
            </Button>
            <Button tone="danger" onClick={() => blocker.proceed?.()}>
              Leave anyway
            </Button>
          </div>
        </div>
      ) : null}
      {conflict ? (
        <div role="alert" className="rounded-md border-2 border-alarm bg-panel p-2 text-sm">
          <p className="font-bold">⛔ {conflict.message}</p>
          <p className="mt-1">Their text, as saved:</p>
          {h.notesVersion > conflict.myVersion ? (
            <div className="order-body border-l-4 border-line pl-2" data-testid="their-notes" dangerouslySetInnerHTML={{ __html: h.notesHtml }} />
          ) : (
            <p className="text-muted">Fetching their text…</p>
          )}
          <p className="mt-1">Your text stays in the editor above; merge what you need from theirs.</p>
          <Button
            className="mt-1"
            disabled={h.notesVersion <= conflict.myVersion}
            onClick={() => {
              version.current = h.notesVersion;
              setConflict(null);
            }}
          >
            Save my text over theirs
          </Button>
        </div>
      ) : null}
    </div>
  );
}
