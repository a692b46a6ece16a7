import { expect, test, type Page } from '@playwright/test';
import { signIn, signInReadingOrders } from './support';

/** Collects the write requests a page sends to paths matching `pattern`. */
function writesTo(page: Page, pattern: RegExp) {
  const seen: string[] = [];
  page.on('request', (r) => {
    if (r.method() !== 'GET' && pattern.test(r.url())) seen.push(r.url());
  });
  return seen;
}

test('a limit typed as "1O" is marked beside its box and nothing is sent; a value comes back as typed', async ({ page }) => {
  await signIn(page, 'admin@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Plant setup' }).click();
  const form = page.getByRole('form', { name: 'Limit set' });
  const highWatch = form.getByLabel('Terminal temperature difference (TTD) high watch');
  const sent = writesTo(page, /limit-versions/);

  await highWatch.fill('1O');
  await form.getByLabel('What changed and why').fill('Typo check');
  await form.getByRole('button', { name: 'Save limits as a new version' }).click();
  await expect(highWatch).toHaveAttribute('aria-invalid', 'true');
  await expect(form.getByRole('alert').filter({ hasText: '“1O” is not a number' })).toBeVisible();
  await expect(form.getByText('Nothing was saved')).toBeVisible();
  expect(sent).toEqual([]);

  // 0.7 kPa is 700 Pa in SI; it must come back as 0.7, not 0.7000000000000001.
  const deviation = form.getByLabel('Backpressure deviation (actual − expected) high watch');
  await deviation.fill('0.7');
  await highWatch.fill('7.15');
  await form.getByRole('button', { name: 'Save limits as a new version' }).click();
  await expect(form.getByText('Saved as a new version')).toBeVisible();
  expect(sent).toHaveLength(1);
  await page.reload();
  await expect(page.getByRole('form', { name: 'Limit set' }).getByLabel('Backpressure deviation (actual − expected) high watch')).toHaveValue('0.7');
  await expect(page.getByRole('form', { name: 'Limit set' }).getByLabel('Terminal temperature difference (TTD) high watch')).toHaveValue('7.15');
});

test('an empty log entry and an empty round say which field is missing', async ({ page }) => {
  await signInReadingOrders(page, 'field.a@fernhollow.example');
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link', { name: 'Shift log' }).click();
  const entry = page.getByRole('form', { name: 'New log entry' });
  await entry.getByRole('button', { name: 'Log it' }).click();
  await expect(entry.getByText('Entry text is missing')).toBeVisible();
  await expect(entry.getByLabel('Entry text')).toHaveAttribute('aria-invalid', 'true');

  await nav.getByRole('link', { name: 'Rounds' }).click();
  const round = page.getByRole('form', { name: 'Record a round' });
  await round.getByRole('button', { name: 'Save round' }).click();
  await expect(page.getByText(/Nothing was saved; see the readings marked below: .*Hotwell temperature/)).toBeVisible();
  await expect(round.getByText('Hotwell temperature is missing')).toBeVisible();
});
