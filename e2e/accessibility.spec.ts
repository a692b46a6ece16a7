// Every page each role can reach, in the light theme (and in the dark one once per page), checked by axe-core against WCAG 2.0/2.1
// A and AA: no serious or critical violation. The pages come from the navigation table (the same one the
// menu is built from), so a new page in the menu is checked without touching this file.
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { navigationFor } from '../src/app/navigation';
import type { Role } from '../shared/roles';
import { shiftChangeNotWithin, signIn } from './support';

const people: { role: Role; email: string }[] = [
  { role: 'trainee', email: 'trainee.a@fernhollow.example' },
  { role: 'operator', email: 'operator.b@fernhollow.example' },
  { role: 'shift_lead', email: 'lead.b@fernhollow.example' },
  { role: 'trainer', email: 'trainer@fernhollow.example' },
  { role: 'admin', email: 'admin@fernhollow.example' },
];

const themes = ['light', 'dark'] as const;

type Finding = { page: string; theme: string; id: string; impact: string; help: string; nodes: string[] };

/** Sets the theme as the toggle does (src/lib/theme.ts): an attribute on <html>, no reload. */
const useTheme = (page: Page, theme: (typeof themes)[number]) =>
  page.evaluate((t) => {
    document.documentElement.dataset.theme = t;
    localStorage.setItem('hotwell.theme', t);
  }, theme);

// Pages whose dark theme has been checked already (by an earlier role: the run is one worker, in order).
const darkChecked = new Set<string>();

/**
 * Light: every WCAG 2.0/2.1 A and AA rule, for every role. Dark: the rule a theme can change, colour
 * contrast (names, roles, labels and structure are the same markup in both), once per page — the
 * theme's colours do not depend on who is signed in — which keeps the run short.
 */
async function check(page: Page, where: string): Promise<Finding[]> {
  const found: Finding[] = [];
  for (const theme of themes) {
    if (theme === 'dark' && darkChecked.has(where)) continue;
    if (theme === 'dark') darkChecked.add(where);
    await useTheme(page, theme);
    const axe = new AxeBuilder({ page });
    const result = await (theme === 'light' ? axe.withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']) : axe.withRules(['color-contrast'])).analyze();
    for (const v of result.violations) {
      if (v.impact !== 'serious' && v.impact !== 'critical') continue;
      found.push({ page: where, theme, id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => `${n.target.join(' ')} — ${n.failureSummary?.split('\n').slice(1).join(' ').trim() ?? ''}`) });
    }
  }
  // Said as found, so a run cut short still shows what it had seen.
  if (found.length) console.log(readable(found));
  return found;
}

const readable = (findings: Finding[]) =>
  findings.map((f) => `\n[${f.impact}] ${f.page} (${f.theme}): ${f.id} — ${f.help}${f.nodes.map((n) => `\n    ${n}`).join('')}`).join('');

/** The page has drawn: its heading is there and nothing says it is still loading. */
async function settled(page: Page) {
  await expect(page.locator('main h1').first()).toBeVisible({ timeout: 15_000 });
  await expect(page.getByText(/^Loading/)).toHaveCount(0, { timeout: 15_000 });
}

test('the sign-in page has no serious or critical accessibility violation', async ({ page }) => {
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  const findings = await check(page, '/sign-in');
  expect(findings, readable(findings)).toEqual([]);
});

for (const { role, email } of people) {
  test(`every page a ${role} reaches has no serious or critical accessibility violation, light and dark`, async ({ page }) => {
    // Seconds a page on a shared 2-core machine (one or two axe runs each); up to 17 pages for an admin.
    test.setTimeout(600_000);
    await signIn(page, email);
    await expect(page.getByTestId('signed-in-as')).toBeVisible();
    const findings: Finding[] = [];
    for (const item of navigationFor(role)) {
      await test.step(item.to, async () => {
        await page.goto(item.to);
        await settled(page);
        findings.push(...(await check(page, item.to)));
      });
    }
    expect(findings, readable(findings)).toEqual([]);
  });
}

// Pages reached through a record rather than the menu: opened by the link a person would follow, from
// the page that lists the record (the demo has one of each), then checked as above.
const recordPages: { name: string; email: string; from: string; link: string }[] = [
  { name: 'a round', email: 'operator.b@fernhollow.example', from: '/rounds?unit=1', link: 'a[href^="/rounds/"]' },
  { name: 'a past shift in the logbook', email: 'trainer@fernhollow.example', from: '/logbook?q=seal', link: 'a[href^="/logbook/units/"]' },
  { name: 'a trainee’s record', email: 'trainer@fernhollow.example', from: '/training', link: 'a[href^="/training/trainees/"]' },
];

/** Opens `href` and checks it once drawn. */
async function checkRecordPage(page: Page, href: string) {
  await page.goto(href);
  await expect(page.locator('h1').first()).toBeVisible({ timeout: 15_000 });
  await expect(page.getByText(/^Loading/)).toHaveCount(0, { timeout: 15_000 });
  return check(page, href.replace(/\?.*$/, '').replace(/\d[^/]*/g, ':id'));
}

for (const { name, email, from, link } of recordPages) {
  test(`${name} has no serious or critical accessibility violation, light and dark`, async ({ page }) => {
    await signIn(page, email);
    await expect(page.getByTestId('signed-in-as')).toBeVisible();
    await page.goto(from);
    const first = page.locator(link).first();
    await expect(first, `no link to ${name} on ${from}`).toBeVisible({ timeout: 15_000 });
    const findings = await checkRecordPage(page, (await first.getAttribute('href'))!);
    expect(findings, readable(findings)).toEqual([]);
  });
}

// The print view of a handover is opened from its board: the outgoing operator starts this shift's
// draft unless an earlier test has, and follows "Print view".
test('a handover’s print view has no serious or critical accessibility violation, light and dark', async ({ page, baseURL }) => {
  const change = await shiftChangeNotWithin(baseURL!, 2);
  await signIn(page, `operator.${change.outgoing}@fernhollow.example`);
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.goto(`/handover?unit=${change.unitId}`);
  if (!change.draftStarted) await page.getByRole('button', { name: 'Start this shift’s handover' }).click();
  const print = page.getByRole('link', { name: 'Print view' });
  await expect(print).toBeVisible({ timeout: 15_000 });
  const findings = await checkRecordPage(page, (await print.getAttribute('href'))!);
  expect(findings, readable(findings)).toEqual([]);
});
