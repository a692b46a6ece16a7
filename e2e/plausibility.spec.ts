import { expect, test } from '@playwright/test';
import { signIn } from './support';

test('an impossible CW flow is refused beside the box; a plausible-but-odd one asks before it is saved, marked', async ({ page }) => {
  await signIn(page, 'operator.b@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Rounds' }).click();
  const form = page.getByRole('form', { name: 'Record a round' });
  await form.getByLabel('Pressure gauge').selectOption('kPa_a');
  await form.getByLabel('Temperatures').selectOption('degC');

  // The probe's 1e9 m³/h: no condenser has it (physical range, common practice).
  const flow = form.getByLabel('CW flow', { exact: true });
  await flow.fill('1e9');
  await expect(form.getByText('CW flow must be between 0 m³/h and 1,000,000 m³/h')).toBeVisible();

  // Demo design 15 000 kg/s at 22 °C ≈ 54 120 m³/h (Kell 1975 density); 80 000 m³/h is 148 % of it,
  // above the starting 20–130 % (common practice, no source). 5.5 kPa a, 22 → 28 °C carry the design duty.
  await form.getByLabel('Condenser absolute pressure').fill('5.5');
  await form.getByLabel('Hotwell temperature').fill('34.3');
  await form.getByLabel('CW inlet temperature').fill('22');
  await form.getByLabel('CW outlet temperature').fill('28');
  await flow.fill('80000');
  await expect(form.getByText('CW flow must be between')).toHaveCount(0);
  await expect(form.getByText(/CW flow 80,000 m³\/h is outside the plausible range for this unit \(10,820–70,360 m³\/h, 20–130 % of design flow\)/)).toBeVisible();
  await expect(page.getByTestId('check-duty')).toContainText('not computed: CW flow is outside the plausible range');

  await form.getByRole('button', { name: 'Save round' }).click();
  const ask = page.getByRole('alertdialog', { name: 'Outside the plausible range' });
  await expect(ask).toContainText('This reading is outside the plausible range for this unit; check the instrument; save anyway?');
  await expect(page.getByText('Round saved.')).toHaveCount(0);
  await ask.getByRole('button', { name: 'Go back and check' }).click();
  await expect(ask).toHaveCount(0);

  await form.getByRole('button', { name: 'Save round' }).click();
  await ask.getByRole('button', { name: 'Save anyway, marked outside plausible range' }).click();
  await expect(page.getByText('Round saved.')).toBeVisible();
  const saved = page.getByRole('link', { name: 'Open it' });
  const id = (await saved.getAttribute('href'))!.split('/').pop();
  await expect(page.getByTestId(`reading-${id}`).getByTestId('outside-plausible')).toContainText('Outside plausible range: CW flow');

  await saved.click();
  await expect(page.getByRole('heading', { name: /round of/i })).toBeVisible();
  await expect(page.getByTestId('outside-plausible').first()).toContainText('CW flow');
  await expect(page.getByTestId('check-duty')).toContainText('not computed: CW flow is outside the plausible range');
  await expect(page.getByTestId('check-cwFlow')).toContainText('outside the plausible range');

  // The trend keeps the odd point off its scale and says so.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Trends' }).click();
  await page.getByLabel('Show').selectOption({ label: 'CW flow' });
  await page.getByLabel('Period').selectOption({ label: 'Last 24 hours' });
  await expect(page.getByTestId('trend-outside-plausible')).toContainText('1 point lies outside the unit’s plausible range');
});
