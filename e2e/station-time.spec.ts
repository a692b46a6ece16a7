import { expect, test } from '@playwright/test';
import { formatStationTime, toStationInputValue } from '../shared/station-time';
import { signIn } from './support';

// The device is nine hours behind the demo station in winter: a time read on the device's clock
// would land in the future (refused) or nine hours off.
test.use({ timezoneId: 'America/Los_Angeles' });

test('a round typed on a device far from the station is recorded and listed at that station time', async ({ page }) => {
  await signIn(page, 'operator.b@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rounds' }).click();
  // The browser really is in Los Angeles.
  expect(await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone)).toBe('America/Los_Angeles');

  const units = (await (await page.request.get('/api/plant/units')).json()) as { units: { id: number; timeZone: string }[] };
  const zone = units.units[0]!.timeZone;
  const form = page.getByRole('form', { name: 'Record a round' });
  await expect(form.getByTestId('station-time-zone')).toContainText(`Station time — ${zone}`);

  // Forty minutes ago on the station's clock, to the minute.
  const takenAt = new Date(Math.floor((Date.now() - 40 * 60_000) / 60_000) * 60_000);
  const typed = toStationInputValue(takenAt, zone);
  await form.getByLabel('Taken at (leave empty for now)').fill(typed);
  await form.getByLabel('Condenser absolute pressure').fill('6.5');
  await form.getByLabel('Hotwell temperature').fill('37');
  await form.getByLabel('CW inlet temperature').fill('25');
  await form.getByLabel('CW outlet temperature').fill('34');
  await form.getByLabel('CW flow', { exact: true }).fill('54000');
  await form.getByRole('button', { name: 'Save round' }).click();
  await expect(page.getByText('Round saved.')).toBeVisible();

  const href = await page.getByRole('link', { name: 'Open it' }).getAttribute('href');
  const id = Number(href!.split('/').pop());
  const shown = typed.replace('T', ' ');
  expect(shown).toBe(formatStationTime(takenAt, zone));
  await expect(page.getByTestId(`reading-${id}`)).toContainText(shown);
  await expect(page.getByRole('columnheader', { name: `Taken (station time, ${zone})` })).toBeVisible();

  // The stored instant is the one typed on the station's clock, not on the device's.
  const stored = (await (await page.request.get(`/api/readings/${id}`)).json()) as { reading: { takenAt: string } };
  expect(new Date(stored.reading.takenAt).getTime()).toBe(takenAt.getTime());

  await page.getByTestId(`reading-${id}`).getByRole('link').click();
  await expect(page.getByRole('heading', { name: new RegExp(`round of ${shown}`, 'i') })).toBeVisible();
  await expect(page.getByTestId('zone-note')).toContainText(`Times in station time — ${zone}`);
});
