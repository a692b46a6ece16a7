import { expect, test } from '@playwright/test';
import { signInReadingOrders } from './support';

// Hourly rows from 20 days ago (after the demo's first design data and limits, before its rounds):
// a clean condenser on Unit 1's design (as the demo's own rounds are made), inside every starting
// limit, so no flag is raised for other tests to meet.
const hour = 3_600_000;
const start = Math.floor((Date.now() - 20 * 24 * hour) / hour) * hour;
const line = (i: number) => `${new Date(start + i * hour).toISOString()},4.66,31.1,21.1,28.5,53569`;
const csv = (indexes: number[]) => Buffer.from(['Timestamp,Cond press,Hotwell,CW in,CW out,CW flow', ...indexes.map(line)].join('\n') + '\n');

test('an import reports rows stored, in batches, and rows already there from an earlier one', async ({ page }) => {
  await signInReadingOrders(page, 'operator.d@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Import' }).click();
  // The unit is known before a file is chosen (the page names it).
  await expect(page.getByText(/^Unit 1 · CSV \(UTF-8\)/)).toBeVisible();
  const fileInput = page.getByLabel('1 · Choose the file');

  await fileInput.setInputFiles({ name: 'drill-export.csv', mimeType: 'text/csv', buffer: csv([0, 1, 2]) });
  const mapping = page.getByRole('form', { name: 'Map the columns' });
  await mapping.getByLabel('Source name (remembered with this mapping)').fill('Drill historian export');
  await mapping.getByLabel(/^Time column/).selectOption('Timestamp');
  for (const [label, column, unit] of [
    ['Condenser pressure / vacuum', 'Cond press', 'kPa_a'],
    ['Hotwell temperature', 'Hotwell', 'degC'],
    ['CW inlet temperature', 'CW in', 'degC'],
    ['CW outlet temperature', 'CW out', 'degC'],
    ['CW flow', 'CW flow', 'm3_h'],
  ] as const) {
    await mapping.getByLabel(`Column for ${label}`, { exact: true }).selectOption(column);
    await mapping.getByLabel(`Unit for ${label}`, { exact: true }).selectOption(unit);
  }
  await mapping.getByRole('button', { name: '3 · Check every row' }).click();
  await expect(page.getByText(/Rows are stored in batches: if the import stops part-way, the batches already stored stay/)).toBeVisible();
  await page.getByRole('button', { name: '4 · Import 3 rows' }).click();
  await expect(page.getByTestId('import-result')).toHaveText(/Stored 3 rows in 1 batch of up to 100; 0 rows already there from an earlier import, skipped; 0 new flag\(s\) raised\./);

  // The next export overlaps: two rows are there already, one is new. The mapping is remembered.
  await fileInput.setInputFiles({ name: 'drill-export-2.csv', mimeType: 'text/csv', buffer: csv([1, 2, 3]) });
  await expect(mapping.getByLabel('Source name (remembered with this mapping)')).toHaveValue('Drill historian export');
  await mapping.getByRole('button', { name: '3 · Check every row' }).click();
  await page.getByRole('button', { name: '4 · Import 1 rows' }).click();
  await expect(page.getByTestId('import-result')).toHaveText(/Stored 1 row in 1 batch of up to 100; 2 rows already there from an earlier import, skipped/);
});
