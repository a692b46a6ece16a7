// The outgoing crew's notes editor: what is typed is kept on the device at once and comes back
// after a remount (a reload, a closed tab); a save that clashes with someone else's keeps both
// texts side by side and offers the choices.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, render, screen, waitFor, within } from '@testing-library/react';
import { useState } from 'react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { describe, expect, it } from 'vitest';
import { handoverKeys, type Board } from '../../src/features/handover/api/handover';
import { HandoverNotes } from '../../src/features/handover/components/handover-notes';
import { fakeServer } from './support/fake-server';

const board = (notesHtml: string, notesVersion: number): Board => ({
  handover: {
    id: 41,
    unitId: 1,
    shiftStart: '2026-03-05T05:00:00.000Z',
    handoverAt: '2026-03-05T17:00:00.000Z',
    outgoingCrewId: 1,
    incomingCrewId: 2,
    notesHtml,
    notesVersion,
    status: 'draft',
    startedBy: 'Ola Operator',
    submittedBy: null,
    submittedAt: null,
    acceptedBy: null,
    acceptedAt: null,
    condenserSnapshot: null,
  },
  items: [],
  amendments: [],
  incomingCrew: [],
  waiting: [],
});

const stationTime = (iso: string) => `${iso.slice(11, 16)} (station)`;

/**
 * The notes as the board shows them to a writer, inside a data router (the editor guards leaving).
 * `boardFromServer` plays the board's refetch after a live event: same mount, new props.
 */
function renderNotes(initial: Board, client = new QueryClient()) {
  let setBoard: (b: Board) => void = () => {};
  function Page() {
    const [b, set] = useState(initial);
    setBoard = set;
    return <HandoverNotes key={b.handover.id} board={b} editable stationTime={stationTime} />;
  }
  const router = createMemoryRouter([{ path: '/handover', element: <Page /> }], { initialEntries: ['/handover'] });
  const view = render(
    <QueryClientProvider client={client}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { unmount: view.unmount, boardFromServer: (b: Board) => act(() => setBoard(b)) };
}

// The editor's code is loaded when writing starts (a click on the stored notes); a cold load under
// happy-dom can take a few seconds.
const editor = () =>
  waitFor(
    () => {
      const box = screen.getByRole('textbox', { name: 'Handover notes' });
      expect(box.getAttribute('contenteditable')).toBe('true');
      return box;
    },
    { timeout: 5000 },
  );

/**
 * Types at the end of the notes. ProseMirror takes the caret from the DOM selection, which it reads
 * after focus settles: keys pressed before that would be lost, so wait for its focused mark first.
 */
async function typeInNotes(user: ReturnType<typeof userEvent.setup>, text: string) {
  const shown = await screen.findByRole('textbox', { name: 'Handover notes' });
  if (shown.getAttribute('contenteditable') !== 'true') await user.click(shown);
  const box = await editor();
  await user.click(box);
  await waitFor(() => expect(box.classList.contains('ProseMirror-focused')).toBe(true));
  await new Promise((resolve) => setTimeout(resolve, 50));
  await user.keyboard(text);
  await waitFor(() => expect(box.textContent).toContain(text));
}

describe('handover notes: draft kept on the device', () => {
  it('keeps typed text that never reached the server and restores it after a remount', async () => {
    // The server is down: every save fails, so only the device has the text.
    const server = fakeServer({ 'GET /api/session/csrf': { body: { csrfToken: 't' } }, 'PUT /api/handovers/41/notes': { status: 503, body: { error: { code: 'UNAVAILABLE', message: 'The database is not answering' } } } });
    const user = userEvent.setup();
    const first = renderNotes(board('<p>Stored text.</p>', 3));
    await typeInNotes(user, 'CWP-B strainer dP rising. ');
    expect(await screen.findByTestId('notes-status')).toHaveProperty('textContent', 'Unsaved changes (kept on this device)…');
    await waitFor(() => expect(server.writes().length).toBeGreaterThan(0), { timeout: 3000 });
    await waitFor(() => expect(screen.getByTestId('notes-status').textContent).toMatch(/^Unsaved changes/));
    first.unmount();

    // A new mount of the same handover (a reload): the text typed here is back, and says so.
    renderNotes(board('<p>Stored text.</p>', 3));
    expect((await editor()).textContent).toContain('CWP-B strainer dP rising');
    expect(screen.getByTestId('notes-status').textContent).toBe('Unsaved changes (kept on this device)…');
  });
});

describe('handover notes: two writers at once', () => {
  it('on a 409 keeps my text in the editor, shows theirs beside it, and saves mine over theirs only when asked', async () => {
    const conflict = {
      status: 409,
      body: { error: { code: 'NOTES_CONFLICT', message: 'Someone else saved these notes first. Your text stays in the editor and theirs is shown with it; merge the two and save again.' } },
    };
    let saves = 0;
    const server = fakeServer({
      'GET /api/session/csrf': { body: { csrfToken: 't' } },
      'PUT /api/handovers/41/notes': () => (++saves === 1 ? conflict : { body: { version: 5 } }),
    });
    const user = userEvent.setup();
    const view = renderNotes(board('<p>Stored text.</p>', 3));
    await typeInNotes(user, 'Mine: 1-CWP-A bearing warm. ');
    // Meanwhile the other writer's save reaches this board (version 4).
    view.boardFromServer(board('<p>Their text: hotwell level steady.</p>', 4));

    const alert = within(await screen.findByRole('alert', {}, { timeout: 5000 }));
    expect(alert.getByText(/Someone else saved these notes first/)).toBeTruthy();
    expect(alert.getByTestId('their-notes').textContent).toBe('Their text: hotwell level steady.');
    expect((await editor()).textContent).toContain('Mine: 1-CWP-A bearing warm.');
    expect((await editor()).textContent).not.toContain('Their text');
    // My save went out from the version I started on, and nothing is saved again until I choose.
    expect(server.writes()).toHaveLength(1);
    expect(server.writes()[0]!.body).toMatchObject({ version: 3 });
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(server.writes()).toHaveLength(1);
    // Still on the device, should the tab close now.
    expect(JSON.stringify({ ...localStorage })).toContain('Mine: 1-CWP-A bearing warm.');

    await user.click(alert.getByRole('button', { name: 'Save my text over theirs' }));
    await waitFor(() => expect(server.writes()).toHaveLength(2), { timeout: 3000 });
    const second = server.writes()[1]!.body as { html: string; version: number };
    expect(second.version).toBe(4);
    expect(second.html).toContain('Mine: 1-CWP-A bearing warm.');
    await waitFor(() => expect(screen.getByTestId('notes-status').textContent).toBe('Draft saved at ' + stationTime(new Date().toISOString())));
    expect(screen.queryByRole('alert')).toBeNull();
    expect(JSON.stringify({ ...localStorage })).not.toContain('Mine');
  });

  it('on a 409 before their text reached this tab, fetches the board and offers to overwrite only once it has their version', async () => {
    fakeServer({
      'GET /api/session/csrf': { body: { csrfToken: 't' } },
      'PUT /api/handovers/41/notes': { status: 409, body: { error: { code: 'NOTES_CONFLICT', message: 'Someone else saved these notes first.' } } },
    });
    const client = new QueryClient();
    client.setQueryData(handoverKeys.current(1), { board: board('<p>Stored text.</p>', 3) });
    const user = userEvent.setup();
    const view = renderNotes(board('<p>Stored text.</p>', 3), client);
    await typeInNotes(user, 'Mine first. ');
    const alert = within(await screen.findByRole('alert', {}, { timeout: 5000 }));
    // The board this tab has is older than theirs: it is fetched again, and nothing stale is shown as theirs.
    expect(client.getQueryState(handoverKeys.current(1))?.isInvalidated).toBe(true);
    expect(alert.queryByTestId('their-notes')).toBeNull();
    expect(alert.getByText('Fetching their text…')).toBeTruthy();
    expect(alert.getByRole('button', { name: 'Save my text over theirs' })).toHaveProperty('disabled', true);
    view.boardFromServer(board('<p>Their text.</p>', 4));
    expect(alert.getByTestId('their-notes').textContent).toBe('Their text.');
    expect(alert.getByRole('button', { name: 'Save my text over theirs' })).toHaveProperty('disabled', false);
  });
});
