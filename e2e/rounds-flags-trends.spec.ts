import { expect, test } from '@playwright/test';
import { signIn, signOut, typeVacuumRound } from './support';

test('an operator records a round in inHg vacuum with a barometer and an alarm flag is raised', async ({ page }) => {
  await signIn(page, 'operator.b@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rounds' }).click();
  await expect(page.getByTestId('last-reading')).toContainText('Last round');
  const form = page.getByRole('form', { name: 'Record a round' });
  // 25.0 inHg vacuum → 4.92 inHgA = 16.661 kPa a (1 inHg at 32 °F = 3.386389 kPa, NIST SP 811): above the 16 kPa a alarm limit.
  // Warm water (33 → 43 °C) keeps the TTD (13 K) inside its plausible 1–15 K, so no confirmation is asked.
  await typeVacuumRound(form, { vacuumInHg: '25.0', hotwellC: '54.5', cwInC: '33', cwOutC: '43', cwFlowM3h: '54000' });
  // A vacuum gauge takes its barometer in inHg absolute.
  await expect(form.getByLabel('Barometer unit')).toHaveValue('inHgA');
  // Ts(16.661 kPa) = 56.16 °C: IAPWS-IF97 saturation-temperature equation (eq. 31) worked by hand,
  // between the steam tables' 53.97 °C at 15 kPa and 60.06 °C at 20 kPa. Subcooling = 56.16 − 54.5
  // = 1.66 K; TTD = 56.16 − 43 = 13.16 K.
  const shown = (check: string) => page.getByTestId(`check-${check}`).getByRole('cell').nth(1);
  await expect(shown('saturationTemperature')).toHaveText('56.2 °C');
  await expect(shown('subcooling')).toHaveText('1.66 K');
  await expect(shown('ttd')).toHaveText('13.16 K');
  await expect(page.getByTestId('check-backpressure')).toContainText('Alarm');
  await form.getByRole('button', { name: 'Save round' }).click();
  await expect(page.getByText('Round saved.')).toBeVisible();

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Flags' }).click();
  const flag = page.getByRole('article', { name: 'Flag: Condenser absolute pressure' });
  await expect(flag).toContainText('Alarm');
  await expect(flag).toContainText('kPa a');
  await signOut(page);
});

test('the shift lead raises a flag by hand, assigns it and clears it with a comment', async ({ page }) => {
  await signIn(page, 'lead.a@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Flags' }).click();
  const raise = page.getByRole('form', { name: 'Raise a flag' });
  await raise.getByLabel('Parameter').selectOption('towerApproach');
  await raise.getByLabel('Severity').selectOption('watch');
  await raise.getByLabel('Comment').fill('Fan 3 vibration trip; approach will rise this afternoon');
  await raise.getByRole('button', { name: 'Raise flag' }).click();
  const flag = page.getByRole('article', { name: 'Flag: Cooling-tower approach' });
  await expect(flag).toContainText('Fan 3 vibration trip');
  await flag.getByRole('button', { name: 'Assign follow-up' }).click();
  await flag.getByLabel('Who follows it up').selectOption({ label: 'Cato Villanueva' });
  await flag.getByLabel('What to do').fill('Check approach at each round until fan 3 is back');
  await flag.getByRole('button', { name: 'Assign', exact: true }).click();
  await expect(flag).toContainText('Follow-up by Cato Villanueva');
  await flag.getByRole('button', { name: 'Clear flag' }).click();
  await flag.getByLabel('Closing comment').fill('Fan 3 back in service, approach 5 K');
  await flag.getByRole('button', { name: 'Clear with this comment' }).click();
  await expect(page.getByRole('article', { name: 'Flag: Cooling-tower approach' })).toHaveCount(0);
  await page.getByLabel('Status').selectOption('cleared');
  await expect(page.getByRole('article', { name: 'Flag: Cooling-tower approach' })).toContainText('Fan 3 back in service');
});

test('the trend page shows a series with its limit bands', async ({ page }) => {
  await signIn(page, 'trainer@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Trends' }).click();
  await page.getByLabel('Show').selectOption({ label: 'Cleanliness factor' });
  await page.getByLabel('Period').selectOption({ label: 'Last 30 days' });
  await expect(page.getByTestId('trend-points')).not.toHaveText('0 points');
  const chart = page.getByRole('img', { name: /Trend of Cleanliness factor/ });
  await expect(chart).toBeVisible();
  // Demo Unit 1 fouls from 0.90 to 0.72: its trace crosses the 0.75 watch limit band.
  await expect(chart.getByText('▲ watch').first()).toBeVisible();
  await expect(page.getByRole('button', { name: 'Export shown series (CSV)' })).toBeEnabled();
});
