// The shift picture, tried as two crews would with two browsers side by side: a round saved in one
// reaches every open screen of the other at once; the handover editor never mixes up units, and
// text typed just before a reload is still there.
import { expect, test, type Page } from '@playwright/test';
import { shiftChangeNotWithin, shiftChangeNow, signInReadingOrders, typeVacuumRound } from './support';

const nav = (page: Page, name: string) => page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name, exact: true }).click();

/**
 * Starts the unit's draft for the shift in progress unless the server says it is started already
 * (an earlier test may have); either way the board then shows its status.
 */
async function startDraftUnlessStarted(page: Page, baseURL: string, unitName: string) {
  const start = page.getByRole('button', { name: 'Start this shift’s handover' });
  if ((await shiftChangeNow(baseURL, unitName)).draftStarted) await expect(start).toHaveCount(0);
  else await start.click();
  await expect(page.getByTestId('handover-status')).toContainText('Draft');
}

async function chooseUnit(page: Page, label: string) {
  const picker = page.getByRole('combobox', { name: 'Unit', exact: true });
  const option = picker.locator('option').filter({ hasText: label });
  await expect(option).toHaveCount(1);
  await picker.selectOption((await option.getAttribute('value'))!);
}

test('a round with a high backpressure saved in one browser shows within a second on the other’s Flags, board and Overview', async ({ browser, baseURL }) => {
  test.setTimeout(90_000 + 4 * 60_000);
  // The outgoing crew's lead, from the server's rotation now (a run that would cross the change waits for it).
  const change = await shiftChangeNotWithin(baseURL!, 3, 'Unit 2');
  // The watcher: three pages of one person open on Unit 2, as a control room keeps them.
  const watcher = await browser.newContext();
  const flags = await watcher.newPage();
  await signInReadingOrders(flags, `lead.${change.outgoing}@fernhollow.example`);
  await expect(flags.getByRole('heading', { name: 'Overview', exact: true })).toBeVisible();
  const overview = await watcher.newPage();
  await overview.goto('/');
  const board = await watcher.newPage();

  await flags.goto('/flags');
  await chooseUnit(flags, 'Unit 2 ·');
  const unitParam = new URL(flags.url()).searchParams.get('unit')!;
  await board.goto(`/handover?unit=${unitParam}`);
  await startDraftUnlessStarted(board, baseURL!, 'Unit 2');
  await expect(board.getByTestId('condenser-live')).toBeVisible();
  const unit2 = overview.getByRole('article', { name: 'Unit 2 overview' });
  await expect(unit2).toBeVisible();
  const flag = flags.getByRole('article', { name: 'Flag: Condenser absolute pressure' });
  await expect(flag).toHaveCount(0);

  // The recorder, in another browser.
  const recorder = await (await browser.newContext()).newPage();
  await signInReadingOrders(recorder, 'field.a@fernhollow.example');
  await recorder.goto(`/rounds?unit=${unitParam}`);
  const form = recorder.getByRole('form', { name: 'Record a round' });
  // 25.0 inHg vacuum → 4.92 inHgA = 16.66 kPa a (1 inHg at 32 °F = 3.386389 kPa): above the 16 kPa a alarm limit.
  // Warm water (33 → 43 °C) keeps the TTD (13 K) inside its plausible 1–15 K, so no confirmation is asked.
  await typeVacuumRound(form, { vacuumInHg: '25.0', hotwellC: '54.5', cwInC: '33', cwOutC: '43', cwFlowM3h: '54000' });
  await form.getByRole('button', { name: 'Save round' }).click();
  await expect(recorder.getByText('Round saved.')).toBeVisible();

  // From the save's answer, within a second and without a reload, on each of the watcher's pages.
  const soon = { timeout: 1_000 };
  await expect(flag).toContainText('Alarm', soon);
  await expect(board.getByTestId('shift-check-backpressure')).toContainText('16.6', soon);
  await expect(unit2.getByTestId('overview-check-backpressure')).toContainText('16.6', soon);
  await expect(unit2.getByTestId('overview-check-backpressure')).toContainText('Alarm', soon);
  // The draft picked the new flag up as an item by itself.
  await expect(board.getByRole('article', { name: 'Item: Condenser absolute pressure — alarm' })).toBeVisible(soon);
  await watcher.close();
});

test('switching units on the handover keeps each unit’s notes apart, and a reload right after typing keeps the text', async ({ page, baseURL }) => {
  test.setTimeout(90_000 + 4 * 60_000);
  // Notes are written by the outgoing crew: who that is comes from the server's rotation now.
  const change = await shiftChangeNotWithin(baseURL!, 3);
  await signInReadingOrders(page, `operator.${change.outgoing}@fernhollow.example`);
  await nav(page, 'Handover');
  const editor = page.getByRole('textbox', { name: 'Handover notes' });
  // The notes show as stored until a click on them loads the editor, which takes the caret at the end.
  const write = async () => {
    await editor.click();
    await expect(editor).toHaveAttribute('contenteditable', 'true');
    await expect(editor).toBeFocused();
  };
  const startIfNeeded = async (unitName: string) => {
    await startDraftUnlessStarted(page, baseURL!, unitName);
    await expect(editor).toBeVisible();
  };

  await chooseUnit(page, 'Unit 2 ·');
  await startIfNeeded('Unit 2');
  await write();
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type('Unit 2: 2-CWP-A strainer dP rising.');
  await expect(page.getByTestId('notes-status')).toContainText('Draft saved');

  await chooseUnit(page, 'Unit 1 ·');
  await startIfNeeded('Unit 1');
  await expect(editor).not.toContainText('Unit 2');
  await write();
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type('Unit 1: hotwell level steady.');
  await expect(page.getByTestId('notes-status')).toContainText('Draft saved');

  await chooseUnit(page, 'Unit 2 ·');
  await expect(editor).toContainText('Unit 2: 2-CWP-A strainer dP rising.');
  await expect(editor).not.toContainText('Unit 1');
  await expect(page.getByRole('alert').filter({ hasText: 'Someone else saved these notes first' })).toHaveCount(0);

  // The menu keeps the unit: Shift log and back land on Unit 2 again.
  await nav(page, 'Shift log');
  await expect(page).toHaveURL(/unit=/);
  await nav(page, 'Handover');
  await expect(editor).toContainText('Unit 2: 2-CWP-A strainer dP rising.');

  // Typed, then reloaded at once — well before the autosave would run.
  await write();
  await page.keyboard.press('End');
  await page.keyboard.type(' Typed just before a reload.');
  page.once('dialog', (dialog) => void dialog.accept());
  await page.reload();
  await expect(editor).toContainText('Typed just before a reload.');
  await expect(page.getByTestId('notes-status')).toContainText(/Restored|Draft saved|Unsaved/);
  // It reaches the server too: a second browser sees it.
  const other = await (await page.context().browser()!.newContext()).newPage();
  await signInReadingOrders(other, `lead.${change.outgoing}@fernhollow.example`);
  await other.goto(page.url().replace(/^https?:\/\/[^/]+/, ''));
  await expect(other.getByRole('textbox', { name: 'Handover notes' })).toContainText('Typed just before a reload.', { timeout: 10_000 });
});
