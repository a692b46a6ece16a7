// Hotwell in the hand: a phone (390×844) and a tablet (820×1180), as field operators carry them on a
// round. The checks stay in view while a round is typed, the menu reaches every page a role has, and
// every control on the pages used out there is big enough for a finger.
import { expect, test, type Page } from '@playwright/test';
import { signInReadingOrders, typeVacuumRound } from './support';

const devices = [
  { name: 'phone', viewport: { width: 390, height: 844 } },
  { name: 'tablet', viewport: { width: 820, height: 1180 } },
];

/** Each page's link in the menu and the heading that page opens with. */
const everyonesPages: [string, string][] = [
  ['Overview', 'Overview'],
  ['Handover', 'Shift handover'],
  ['Shift log', 'Shift log'],
  ['Standing orders', 'Standing orders'],
  ['Rounds', 'Rounds'],
  ['Flags', 'Flags'],
  ['Trends', 'Trends'],
  ['Condenser check', 'Condenser check'],
  ['Plant setup', 'Plant setup'],
  ['Logbook history', 'Logbook history'],
  ['Training', 'Training'],
  ['My password', 'Change your password'],
];
const importPage: [string, string] = ['Import', 'Import from a historian'];
const adminPages: [string, string][] = [
  ['People', 'People'],
  ['Shifts', 'Shifts and crews'],
  ['Audit trail', 'Audit trail'],
];

const roles = [
  { label: 'operator', email: 'operator.b@fernhollow.example', pages: [...everyonesPages, importPage], groups: ['The shift', 'The plant', 'Records', 'You'] },
  { label: 'administrator', email: 'admin@fernhollow.example', pages: [...everyonesPages, ...adminPages], groups: ['The shift', 'The plant', 'Records', 'You', 'Admin'] },
];

/** Every visible button, field and select on the page lower than 44 px (a tick box counts by its label, the part a finger presses). */
async function controlsUnder44px(page: Page) {
  return page.evaluate(() => {
    const small: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('button, input, select, textarea, [role="button"]')) {
      if (el instanceof HTMLInputElement && el.type === 'hidden') continue;
      const box = el instanceof HTMLInputElement && (el.type === 'checkbox' || el.type === 'radio') ? (el.closest('label') ?? el) : el;
      const rect = box.getBoundingClientRect();
      const style = getComputedStyle(el);
      if (rect.width === 0 || rect.height === 0 || style.visibility === 'hidden') continue;
      const label = (el as HTMLInputElement).labels?.[0]?.textContent ?? el.getAttribute('aria-label') ?? el.textContent ?? '';
      if (rect.height < 44) small.push(`${el.tagName.toLowerCase()} "${label.trim().slice(0, 40)}" ${rect.height.toFixed(1)} px`);
    }
    return small;
  });
}

for (const device of devices) {
  test.describe(`on a ${device.name} (${device.viewport.width}×${device.viewport.height})`, () => {
    test.use({ viewport: device.viewport, hasTouch: true });

    test('a round typed to a high backpressure shows the alarm in view while the focus is still in the form', async ({ page }) => {
      await signInReadingOrders(page, 'operator.b@fernhollow.example');
      await page.getByRole('button', { name: 'Menu' }).click();
      await page.getByTestId('main-menu').getByRole('link', { name: 'Rounds', exact: true }).click();
      await expect(page.getByTestId('last-reading')).toContainText('Last round');
      const form = page.getByRole('form', { name: 'Record a round' });
      const summary = page.getByTestId('checks-summary');
      await expect(summary).toContainText('Checks appear here as you type');
      // 25.0 inHg vacuum → 4.92 inHgA = 16.661 kPa a (1 inHg at 32 °F = 3.386389 kPa, NIST SP 811): above the
      // demo's 16 kPa a alarm limit, as in rounds-flags-trends.spec.ts.
      await typeVacuumRound(form, { vacuumInHg: '25.0', hotwellC: '54.5', cwInC: '33', cwOutC: '43', cwFlowM3h: '54000' });
      const flow = form.getByLabel('CW flow', { exact: true });
      await expect(flow).toBeFocused();

      // The backpressure's line: the shape and word of its status, its value and its unit (in the round's units).
      const backpressure = summary.getByTestId('summary-backpressure');
      await expect(backpressure).toContainText('◆');
      await expect(backpressure).toContainText('Alarm');
      await expect(backpressure).toContainText(/\d/);
      await expect(backpressure).toContainText('inHg');
      await expect(summary).toContainText(/\d+ more normal/);
      // In the viewport as the page stands (no scrolling after the last keystroke), and not covering the focused box.
      const view = page.viewportSize()!;
      const bar = (await summary.boundingBox())!;
      expect(bar.y).toBeGreaterThanOrEqual(0);
      expect(bar.y + bar.height).toBeLessThanOrEqual(view.height);
      const alarm = (await backpressure.boundingBox())!;
      expect(alarm.y).toBeGreaterThanOrEqual(0);
      expect(alarm.y + alarm.height).toBeLessThanOrEqual(view.height);
      const field = (await flow.boundingBox())!;
      expect(field.y).toBeGreaterThanOrEqual(bar.y + bar.height);

      // The full list is one tap away.
      await summary.getByRole('button', { name: 'All checks' }).click();
      const panel = page.getByRole('region', { name: 'All checks' });
      await expect(panel).toBeFocused();
      await expect(page.getByTestId('check-backpressure')).toBeInViewport();
      await expect(page.getByTestId('check-backpressure')).toContainText('Alarm');
    });

    for (const role of roles) {
      test(`the menu reaches every page of an ${role.label}`, async ({ page }) => {
        test.setTimeout(60_000);
        await signInReadingOrders(page, role.email);
        const button = page.getByRole('button', { name: 'Menu' });
        const menu = page.getByTestId('main-menu');
        await expect(button).toHaveAttribute('aria-expanded', 'false');
        await expect(menu).toBeHidden();
        expect(await button.getAttribute('aria-controls')).toBe(await menu.getAttribute('id'));

        // Escape closes it and gives the focus back to the button.
        await button.click();
        await expect(button).toHaveAttribute('aria-expanded', 'true');
        await expect(menu).toBeVisible();
        for (const group of role.groups) await expect(menu.getByRole('group', { name: group })).toBeVisible();
        await expect(menu.getByRole('group')).toHaveCount(role.groups.length);
        await expect(menu.getByRole('link')).toHaveCount(role.pages.length);
        await page.keyboard.press('Escape');
        await expect(menu).toBeHidden();
        await expect(button).toBeFocused();

        for (const [link, heading] of role.pages) {
          await button.click();
          await menu.getByRole('link', { name: link, exact: true }).click();
          await expect(page.getByRole('heading', { level: 1, name: heading })).toBeVisible();
          // Following a link closes the menu; opened again, it marks where the person is.
          await expect(menu).toBeHidden();
          await expect(button).toHaveAttribute('aria-expanded', 'false');
          await button.click();
          await expect(menu.getByRole('link', { name: link, exact: true })).toHaveAttribute('aria-current', 'page');
          await expect(menu.locator('[aria-current="page"]')).toHaveCount(1);
          await button.click();
          await expect(menu).toBeHidden();
        }
      });
    }
  });
}

test.describe('on a phone, touch targets', () => {
  test.use({ viewport: { width: 390, height: 844 }, hasTouch: true });

  test('no control on the shift log or the rounds page is under 44 px high', async ({ page }) => {
    // operator.a wrote demo entries, so the log shows the Amend buttons too.
    await signInReadingOrders(page, 'operator.a@fernhollow.example');
    await page.goto('/log');
    await expect(page.getByRole('list', { name: 'Log entries' }).getByRole('listitem').first()).toBeVisible();
    await expect(page.getByRole('button', { name: 'Amend' }).first()).toBeVisible();
    await expect(page.getByLabel('Entry text')).toBeVisible();
    expect(await controlsUnder44px(page)).toEqual([]);
    // Nothing pushes the page wider than the phone (a long select once did).
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

    await page.goto('/rounds');
    await expect(page.getByTestId('last-reading')).toContainText('Last round');
    await expect(page.getByRole('button', { name: 'Save round' })).toBeVisible();
    expect(await controlsUnder44px(page)).toEqual([]);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  });
});
