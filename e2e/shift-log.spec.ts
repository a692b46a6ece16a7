import { expect, test } from '@playwright/test';
import { toStationInputValue } from '../shared/station-time';
import { apiAs, signIn, signInReadingOrders } from './support';

test('keyboard-only entries, one late, appear live in a second browser; the lead signs the review', async ({ browser }) => {
  const writerContext = await browser.newContext();
  const readerContext = await browser.newContext();
  const writer = await writerContext.newPage();
  const reader = await readerContext.newPage();

  await signIn(reader, 'lead.b@fernhollow.example');
  await reader.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
  await expect(reader.getByRole('list', { name: 'Log entries' })).toBeVisible();

  await signIn(writer, 'operator.c@fernhollow.example');
  await writer.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
  const text = writer.getByLabel('Entry text');
  await text.focus();
  await writer.keyboard.type('Started 1-CWP-B after seal replacement; amps steady');
  await writer.keyboard.press('Enter');
  await expect(text).toHaveValue('');
  await expect(writer.getByText('Started 1-CWP-B after seal replacement; amps steady')).toBeVisible();

  // A late entry: the event happened an hour ago, typed on the station's clock.
  const units = (await (await writer.request.get('/api/plant/units')).json()) as { units: { timeZone: string }[] };
  await writer.getByLabel('Event time (empty = now)').fill(toStationInputValue(Date.now() - 60 * 60_000, units.units[0]!.timeZone));
  await text.focus();
  await writer.keyboard.type('Hotwell level alarm cleared itself at the time; noted late');
  await writer.keyboard.press('Enter');
  await expect(writer.getByText('Saved as a late entry')).toBeVisible();

  // The second browser sees both without reloading.
  await expect(reader.getByText('Started 1-CWP-B after seal replacement; amps steady')).toBeVisible();
  const lateEntry = reader.getByRole('listitem').filter({ hasText: 'Hotwell level alarm cleared itself' });
  await expect(lateEntry).toContainText('late entry');

  // The shift lead signs the end-of-shift review.
  await reader.getByRole('button', { name: 'Sign as reviewed' }).click();
  await expect(reader.getByTestId('review-signed')).toContainText('Reviewed by Femi Achterberg');

  await writerContext.close();
  await readerContext.close();
});

test('an operator acknowledges a standing order at sign-in, and the lead sees it counted', async ({ page, baseURL }) => {
  // The scene: whatever operator.a has read in earlier tests (any may sign them in), a shift lead
  // issues a new order now, so exactly that one waits for them at sign-in.
  const operator = await apiAs(baseURL!, 'operator.a@fernhollow.example');
  const { orders } = (await (await operator.api.get('/api/me/pending-orders')).json()) as { orders: { id: number }[] };
  for (const o of orders) expect((await operator.api.post(`/api/standing-orders/${o.id}/acknowledge`, { headers: { 'x-csrf-token': operator.csrf }, data: {} })).ok()).toBe(true);
  const title = `Unit 1: hourly TTD while cleanliness is below 0.75 (${Date.now()})`;
  // For crew A's control room only (operator.a and lead.a, who reads it in a later test of this file).
  const lead = await apiAs(baseURL!, 'lead.a@fernhollow.example');
  const crews = ((await (await lead.api.get('/api/plant/crews')).json()) as { crews: { id: number; name: string }[] }).crews;
  const crewA = crews.find((c) => c.name.toLowerCase() === 'a')!;
  const issued = await lead.api.post('/api/standing-orders', {
    headers: { 'x-csrf-token': lead.csrf },
    data: { title, bodyHtml: '<p>Log TTD every hour until the tubes are cleaned.</p>', effectiveFrom: new Date(Date.now() - 60_000).toISOString(), crewIds: [crewA.id], positions: ['control_room'] },
  });
  expect(issued.ok()).toBe(true);

  await signIn(page, 'operator.a@fernhollow.example');
  const prompt = page.getByRole('dialog', { name: 'Standing orders to acknowledge' });
  await expect(prompt).toContainText(title);
  await prompt.getByRole('button', { name: 'I have read this order' }).click();
  await expect(prompt).toHaveCount(0);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Standing orders' }).click();
  const order = page.getByRole('article', { name: `Order: ${title}` });
  await order.getByRole('button', { name: 'Who has read it' }).click();
  await expect(order.getByRole('list', { name: 'Acknowledgements' })).toContainText('✔ Cato Villanueva');
  await operator.api.dispose();
  await lead.api.dispose();
});

test('a time-limited condition shows its countdown and deadline', async ({ page }) => {
  await signIn(page, 'trainer@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
  const condition = page.getByRole('article', { name: 'Condition: 1-CWP-B out of service (seal replacement)' });
  await expect(condition).toContainText('time left');
  await expect(condition.getByTestId(/countdown-/)).toHaveText(/^\d+ d \d+ h \d\d min$/);
  await expect(condition).toContainText('Europe/Berlin');
});

test('a trainee’s entry is marked as a trainee’s; its writer and the lead of the crew on shift may amend it, another operator may not', async ({ browser }) => {
  const text = `Basin level checked at the tower, ${Date.now()}`;
  const open = async (email: string) => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInReadingOrders(page, email);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
    return { page, context, entry: page.getByRole('listitem').filter({ hasText: text }) };
  };
  const trainee = await open('trainee.a@fernhollow.example');
  await trainee.page.getByLabel('Entry text').fill(text);
  await trainee.page.getByLabel('Entry text').press('Enter');
  await expect(trainee.entry).toContainText('trainee’s entry');
  await expect(trainee.entry.getByRole('button', { name: 'Amend' })).toBeVisible();

  // Crew A is on shift in the demo: another of its operators did not write it; its lead answers for the shift's log.
  const operator = await open('field.a@fernhollow.example');
  await expect(operator.entry).toContainText('trainee’s entry');
  await expect(operator.entry.getByRole('button', { name: 'Amend' })).toHaveCount(0);
  const lead = await open('lead.a@fernhollow.example');
  await lead.entry.getByRole('button', { name: 'Amend' }).click();
  await lead.page.getByLabel('Corrected text').fill(`${text}; level normal`);
  await lead.page.getByLabel('Reason for the amendment').fill('Added what was seen');
  await lead.page.getByRole('button', { name: 'Save amendment' }).click();
  await expect(lead.entry).toContainText('Amended by Bram Okonkwo-Reyes');
  for (const who of [trainee, operator, lead]) await who.context.close();
});
