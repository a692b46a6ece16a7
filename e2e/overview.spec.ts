import { expect, test } from '@playwright/test';
import { signIn } from './support';

test('the overview shows Unit 1’s crew on shift, its latest round with units and statuses, and its open flags', async ({ browser }) => {
  // A device in another zone: the page must still speak station time.
  const page = await (await browser.newContext({ timezoneId: 'America/Los_Angeles' })).newPage();
  await signIn(page, 'operator.a@fernhollow.example');
  await expect(page.getByRole('heading', { name: 'Overview', exact: true })).toBeVisible();

  const waiting = page.getByRole('region', { name: 'Waiting on you' });
  const unit1 = page.getByRole('article', { name: 'Unit 1 overview' });
  await expect(waiting).toBeVisible();
  await expect(unit1).toBeVisible();
  // What waits on the person comes first.
  expect((await waiting.boundingBox())!.y).toBeLessThan((await unit1.boundingBox())!.y);

  // Demo rotation: crew A is on shift, crew B comes next; the station is in Europe/Berlin.
  await expect(unit1.getByTestId('crew-on-shift')).toContainText('On shift: Crew A');
  await expect(unit1.getByTestId('crew-on-shift')).toContainText('Cato Villanueva (Operator)');
  await expect(unit1.getByText(/Next change \d{4}-\d{2}-\d{2} (06|18):00 \(Europe\/Berlin\), Crew B coming in/)).toBeVisible();

  const round = unit1.getByRole('region', { name: 'Latest round' });
  await expect(round.getByTestId('round-age')).toHaveText(/^\d+ (min|h \d{2} min) ago$/);
  await expect(round.getByRole('link', { name: /\(Europe\/Berlin\)$/ })).toBeVisible();
  const backpressure = round.getByTestId('overview-check-backpressure');
  await expect(backpressure).toContainText('Condenser absolute pressure');
  await expect(backpressure).toContainText('kPa a');
  await expect(backpressure).toContainText(/Normal|Watch|Alarm/);
  // A value with its unit, not just the unit: a check without a value would show "—".
  await expect(round.getByTestId('overview-check-saturationTemperature')).toContainText(/\d+\.\d °C/);
  await expect(round.getByTestId('overview-check-deviationCostPower')).toContainText(/\d+\.\d{2} MW/);
  // Demo Unit 1's tubes foul to a cleanliness of about 0.72, under the 0.75 watch limit.
  await expect(round.getByTestId('overview-check-cleanlinessFactor')).toContainText('Watch');

  const flags = unit1.getByRole('region', { name: 'Open flags' });
  await expect(flags.getByTestId('flag-count-watch')).toContainText(/[1-9]\d* open/);
  await expect(flags.getByRole('listitem').filter({ hasText: 'Cleanliness factor' })).toContainText('Watch');

  // Each page opens on this unit.
  const roundsLink = unit1.getByRole('navigation', { name: 'Unit 1 pages' }).getByRole('link', { name: 'Rounds' });
  await expect(roundsLink).toHaveAttribute('href', /^\/rounds\?unit=\d+$/);
  await roundsLink.click();
  await expect(page).toHaveURL(/\/rounds\?unit=\d+$/);
  await expect(page.getByTestId('last-reading')).toContainText('Last round');
});
