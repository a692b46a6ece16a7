import { expect, test } from '@playwright/test';
import { signIn } from './support';

test('an operator types a round and sees the checks, statuses and units update live', async ({ page }) => {
  await signIn(page, 'operator.a@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Condenser check' }).click();
  await expect(page.getByText('Hotwell is a record and an aid')).toBeVisible();

  await page.getByLabel('Condenser absolute pressure').fill('8');
  await page.getByLabel('Hotwell temperature').fill('40');
  await page.getByLabel('CW inlet temperature').fill('22');
  await page.getByLabel('CW outlet temperature').fill('31');
  // IAPWS-IF97: Ts(8 kPa) = 41.51 °C (steam tables)
  await expect(page.getByTestId('check-saturationTemperature')).toContainText('41.5 °C');
  await expect(page.getByTestId('check-subcooling')).toContainText('1.51 K');
  await expect(page.getByTestId('check-duty')).toContainText('needed for the duty');

  await page.getByLabel('CW flow', { exact: true }).fill('54000');
  // By hand: 54 000 m³/h = 15 m³/s of water at about 998 kg/m³ and 4.18 kJ/(kg·K), warmed 9 K:
  // Q = 15 × 998 × 4.18 × 9 ≈ 563 MW (561–565 MW across the density and heat capacity of 22–31 °C water).
  await expect(page.getByTestId('check-duty')).toContainText(/56[1-5]\.\d{2} MW/);
  await expect(page.getByTestId('check-expectedBackpressure')).toContainText(/\d+\.\d{2} kPa a/);

  // A bad value gets a message beside the box, and the checks wait for a good one.
  await page.getByLabel('Relative humidity').fill('130');
  await expect(page.getByText('Relative humidity is 0–100 %')).toBeVisible();
  await page.getByLabel('Relative humidity').fill('');

  // Switching to a vacuum gauge shows the barometer box and the assumption.
  await page.getByLabel('Pressure gauge').selectOption('inHg_vac');
  await expect(page.getByLabel('Barometer', { exact: true })).toBeVisible();
  await page.getByLabel('Condenser vacuum').fill('27.55');
  await expect(page.getByText('the standard atmosphere (101.325 kPa) was assumed')).toBeVisible();
  await expect(page.getByTestId('check-backpressure')).toContainText('inHgA');
});
