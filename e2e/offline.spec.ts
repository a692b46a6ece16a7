import { expect, test, type Page } from '@playwright/test';
import { apiAs, signInReadingOrders, typeVacuumRound } from './support';

// A field operator walks a round where there is no network: the round and a log entry are kept on
// the device, survive a reload without a network (the shell and the data come from the service
// worker), and are stored once each when the network returns, with the times they were entered;
// a second browser sees them arrive. An entry the server refuses on arrival stays with the reason.

type Queued = { clientId: string; kind: string; enteredAt: string; state: string; payload: { text?: string } };

/** The device's queue as IndexedDB holds it (read with the browser's own API). */
const queued = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<Queued[]>((resolve, reject) => {
        const open = indexedDB.open('hotwell-offline');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const all = open.result.transaction('records').objectStore('records').getAll();
          all.onsuccess = () => {
            resolve(all.result as Queued[]);
            open.result.close();
          };
        };
      }),
  );

/** As if the device had been off the network for 8 days: the entry's time of entry moves back. */
const ageEntry = (page: Page, text: string) =>
  page.evaluate(
    ({ text, at }) =>
      new Promise<void>((resolve, reject) => {
        const open = indexedDB.open('hotwell-offline');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const tx = open.result.transaction('records', 'readwrite');
          const store = tx.objectStore('records');
          const all = store.getAll();
          all.onsuccess = () => {
            const record = (all.result as Queued[]).find((r) => r.payload.text === text)!;
            store.put({ ...record, enteredAt: at });
          };
          tx.oncomplete = () => {
            open.result.close();
            resolve();
          };
        };
      }),
    { text, at: new Date(Date.now() - 8 * 86_400_000).toISOString() },
  );

test('a round and a log entry made offline are kept through a reload, then stored once each with their entry times and seen live; a refused one stays with its reason', async ({ browser, baseURL }) => {
  test.setTimeout(90_000);
  const fieldContext = await browser.newContext();
  const watcherContext = await browser.newContext();
  const page = await fieldContext.newPage();
  await signInReadingOrders(page, 'field.c@fernhollow.example');
  // The first visit installs the service worker; the pages opened after it keep what a round needs.
  await page.waitForFunction(() => Boolean(navigator.serviceWorker?.controller));
  await page.goto('/log');
  await expect(page.getByLabel('Entry text')).toBeVisible();
  await page.goto('/rounds');
  await expect(page.getByTestId('last-reading')).toContainText('Last round');

  const roundsWatcher = await watcherContext.newPage();
  await signInReadingOrders(roundsWatcher, 'lead.c@fernhollow.example');
  await roundsWatcher.goto('/rounds');
  await expect(roundsWatcher.getByText('Recent rounds')).toBeVisible();
  const logWatcher = await watcherContext.newPage();
  await logWatcher.goto('/log');
  await expect(logWatcher.getByRole('list', { name: 'Log entries' })).toBeVisible();

  await fieldContext.setOffline(true);
  await expect(page.getByTestId('offline-status')).toContainText('Offline');

  // A round typed in the pump house: judged on the device as it is typed.
  const form = page.getByRole('form', { name: 'Record a round' });
  await typeVacuumRound(form, { vacuumInHg: '28.0', hotwellC: '37', cwInC: '25', cwOutC: '33', cwFlowM3h: '54000' });
  await expect(page.getByTestId('check-saturationTemperature')).toBeVisible();
  await form.getByRole('button', { name: 'Save round' }).click();
  await expect(page.getByText('the round is kept on this device, waiting to send')).toBeVisible();
  await expect(page.getByTestId('waiting-round')).toContainText('waiting to send');
  await expect(page.getByTestId('offline-status')).toContainText('1 record waiting to send');

  // Two log entries; the second will have waited 8 days, past what the server takes.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
  const stamp = Date.now();
  const kept = `Basin B level 72 % at the pump house, makeup valve open (${stamp})`;
  const tooOld = `Tower fan 2 gearbox oil topped up (${stamp})`;
  for (const text of [kept, tooOld]) {
    await page.getByLabel('Entry text').fill(text);
    await page.getByLabel('Entry text').press('Enter');
    await expect(page.getByLabel('Entry text')).toHaveValue('');
  }
  await expect(page.getByTestId('offline-status')).toContainText('3 records waiting to send');
  await ageEntry(page, tooOld);

  // A reload without a network: the shell comes from the service worker, the records from the device.
  await page.reload();
  const waitingLog = page.getByTestId('waiting-log_entry');
  await expect(waitingLog.getByTestId('waiting-record').filter({ hasText: kept })).toContainText('waiting to send');
  await expect(waitingLog.getByTestId('waiting-record').filter({ hasText: kept })).toContainText(/entered \d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}/);
  const before = await queued(page);
  expect(before).toHaveLength(3);
  const round = before.find((r) => r.kind === 'round')!;
  const entry = before.find((r) => r.payload.text === kept)!;

  await fieldContext.setOffline(false);
  await expect(page.getByTestId('offline-status')).toContainText('Online · 1 record refused: fix or discard');
  // Refused on arrival: kept with the server's reason, for its author to fix or discard.
  const refused = waitingLog.getByTestId('waiting-record').filter({ hasText: tooOld });
  await expect(refused).toContainText('refused on arrival');
  await expect(refused).toContainText('Time of entry: Entered more than 7 days ago');
  await expect(refused.getByRole('button', { name: 'Fix and resend' })).toBeVisible();
  await expect(refused.getByRole('button', { name: 'Discard' })).toBeVisible();
  expect((await queued(page)).map((r) => r.payload.text)).toEqual([tooOld]);

  // Stored once each on the server, with the times entered on the device.
  const operator = await apiAs(baseURL!, 'field.c@fernhollow.example');
  const units = ((await (await operator.api.get('/api/plant/units')).json()) as { units: { id: number }[] }).units;
  const unitId = units[0]!.id;
  const readings = ((await (await operator.api.get(`/api/units/${unitId}/readings?limit=200`)).json()) as { readings: { id: number; clientId: string | null; enteredAt: string; takenAt: string }[] }).readings;
  const storedRound = readings.filter((r) => r.clientId === round.clientId);
  expect(storedRound).toHaveLength(1);
  expect(storedRound[0]).toMatchObject({ enteredAt: round.enteredAt, takenAt: round.enteredAt });
  const log = ((await (await operator.api.get(`/api/units/${unitId}/log?limit=500`)).json()) as { entries: { id: number; clientId: string | null; enteredAt: string; text: string }[] }).entries;
  const storedEntry = log.filter((e) => e.clientId === entry.clientId);
  expect(storedEntry).toHaveLength(1);
  expect(storedEntry[0]).toMatchObject({ enteredAt: entry.enteredAt, text: kept });
  expect(log.some((e) => e.text === tooOld)).toBe(false);

  // The second browser saw both arrive without reloading.
  await expect(roundsWatcher.getByTestId(`reading-${storedRound[0]!.id}`)).toBeVisible();
  await expect(logWatcher.getByTestId(`log-entry-${storedEntry[0]!.id}`)).toContainText(kept);

  // The same entry sent again (a retry whose first answer was lost) is the one already stored.
  const retry = await operator.api.post(`/api/units/${unitId}/log`, {
    headers: { 'x-csrf-token': operator.csrf },
    data: { ...entry.payload, clientId: entry.clientId, enteredAt: entry.enteredAt },
  });
  expect(retry.status()).toBe(200);
  expect(((await retry.json()) as { id: number }).id).toBe(storedEntry[0]!.id);
  const again = ((await (await operator.api.get(`/api/units/${unitId}/log?limit=500`)).json()) as { entries: { clientId: string | null }[] }).entries;
  expect(again.filter((e) => e.clientId === entry.clientId)).toHaveLength(1);

  // The refused entry is still on the device after a reload; its author fixes it, and it is stored.
  await page.reload();
  await refused.getByRole('button', { name: 'Fix and resend' }).click();
  await expect(page.getByLabel('Entry text')).toHaveValue(tooOld);
  await page.getByLabel('Event time (empty = now)').fill('');
  await page.getByLabel('Entry text').press('Enter');
  await expect(waitingLog).toHaveCount(0);
  await expect(page.getByTestId('offline-status')).not.toContainText('refused');
  await expect(page.getByRole('list', { name: 'Log entries' })).toContainText(tooOld);
  expect(await queued(page)).toHaveLength(0);

  await operator.api.dispose();
  await fieldContext.close();
  await watcherContext.close();
});
