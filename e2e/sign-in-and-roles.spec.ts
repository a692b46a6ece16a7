import { expect, test } from '@playwright/test';
import { DEMO_PASSWORD, signIn, signOut } from './support';

const everyone = ['Overview', 'Handover', 'Shift log', 'Standing orders', 'Rounds', 'Flags', 'Trends', 'Condenser check', 'Logbook history', 'Training', 'Plant setup', 'My password'];
const adminOnly = ['People', 'Shifts', 'Audit trail'];

// Imports write rounds: operators and shift leads only, administrators not.
const roles = [
  { email: 'trainee.a@fernhollow.example', label: 'Trainee', admin: false, imports: false },
  { email: 'operator.a@fernhollow.example', label: 'Operator', admin: false, imports: true },
  { email: 'lead.a@fernhollow.example', label: 'Shift lead', admin: false, imports: true },
  { email: 'trainer@fernhollow.example', label: 'Trainer', admin: false, imports: false },
  { email: 'admin@fernhollow.example', label: 'Administrator', admin: true, imports: false },
];

for (const role of roles) {
  test(`a ${role.label.toLowerCase()} signs in and sees that role's navigation`, async ({ page }) => {
    await signIn(page, role.email);
    await expect(page.getByTestId('signed-in-as')).toContainText(role.label);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const item of everyone) await expect(nav.getByRole('link', { name: item })).toBeVisible();
    for (const item of adminOnly) {
      if (role.admin) await expect(nav.getByRole('link', { name: item })).toBeVisible();
      else await expect(nav.getByRole('link', { name: item })).toHaveCount(0);
    }
    await expect(nav.getByRole('link', { name: 'Import' })).toHaveCount(role.imports ? 1 : 0);
    await signOut(page);
  });
}

test('a wrong password shows the generic message on the form', async ({ page }) => {
  await signIn(page, 'operator.a@fernhollow.example', 'not the password');
  await expect(page.getByRole('alert')).toContainText('do not match an active account');
});

test('five failed sign-ins lock the e-mail address for a minute, and the form says so', async ({ page }) => {
  const email = `nobody.${Date.now()}@fernhollow.example`;
  for (let i = 0; i < 5; i++) {
    await signIn(page, email, `guess number ${i}`);
    await expect(page.getByRole('alert')).toContainText('do not match an active account');
  }
  await signIn(page, email, 'one more guess');
  await expect(page.getByRole('alert')).toContainText('try again in 1 minute');
});

test('an administrator reads the shift log but writes and amends nothing in it', async ({ page }) => {
  await signIn(page, 'admin@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shift log' }).click();
  await expect(page.getByRole('list', { name: 'Log entries' }).getByRole('listitem').first()).toBeVisible();
  await expect(page.getByLabel('Entry text')).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Amend' })).toHaveCount(0);
  await page.goto('/import');
  await expect(page.getByText('This page is not available to your role.')).toBeVisible();
});

test('an empty form shows a message beside each field', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('Enter your e-mail address')).toBeVisible();
  await expect(page.getByText('Enter your password')).toBeVisible();
});

test('a non-admin who types an admin address gets no admin page', async ({ page }) => {
  await signIn(page, 'operator.a@fernhollow.example');
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.goto('/admin/people');
  await expect(page.getByText('This page is not available to your role.')).toBeVisible();
});

test('an unknown address shows the not-found page', async ({ page }) => {
  await signIn(page, 'operator.a@fernhollow.example');
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.goto('/no-such-page');
  await expect(page.getByRole('heading', { name: 'Nothing here' })).toBeVisible();
});

test('an admin adds a person, who then signs in and must change the password', async ({ page }) => {
  const email = `new.starter.${Date.now()}@fernhollow.example`;
  await signIn(page, 'admin@fernhollow.example');
  await page.getByRole('link', { name: 'People' }).click();
  const form = page.getByRole('form', { name: 'Add a person' });
  await form.getByLabel('Full name').fill('Juno Halvorsen');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Role').selectOption('trainee');
  await form.getByLabel('Crew').selectOption({ label: 'Crew C' });
  await form.getByLabel('Temporary password').fill('first-day-password');
  await form.getByRole('button', { name: 'Add person' }).click();
  await expect(page.getByText('Added Juno Halvorsen')).toBeVisible();
  await expect(page.getByTestId(`user-row-${email}`)).toContainText('temporary password');
  await page.getByRole('link', { name: 'Audit trail' }).click();
  await expect(page.getByRole('cell', { name: 'user.create' }).first()).toBeVisible();
  await signOut(page);

  await signIn(page, email, 'first-day-password');
  await expect(page.getByRole('heading', { name: 'Change your password' })).toBeVisible();
  await expect(page.getByText('You signed in with a temporary password')).toBeVisible();
  // The rest of the app stays closed until the password is changed.
  await page.getByRole('link', { name: 'Overview' }).click();
  await expect(page.getByRole('heading', { name: 'Change your password' })).toBeVisible();
  await page.getByLabel('Current password').fill('first-day-password');
  await page.getByLabel('New password').fill('short');
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Use at least 12 characters')).toBeVisible();
  await page.getByLabel('New password').fill('password1234');
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByText('Too easy to guess')).toBeVisible();
  await page.getByLabel('New password').fill('my own long passphrase');
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByRole('heading', { name: 'Overview' })).toBeVisible();
  await expect(page.getByTestId('signed-in-as')).toContainText('Juno Halvorsen · Trainee · Crew C');
  await signOut(page);

  await signIn(page, email, 'my own long passphrase');
  await expect(page.getByRole('heading', { name: 'Overview' })).toBeVisible();
  expect(DEMO_PASSWORD).not.toBe('my own long passphrase');
});

test('an admin sets the shift clock and records a one-off crew swap', async ({ page }) => {
  await signIn(page, 'admin@fernhollow.example');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Shifts' }).click();
  const clock = page.getByRole('form', { name: 'Station clock and shifts' });
  await clock.getByLabel('Time zone (IANA)').fill('Mars/Olympus');
  await clock.getByRole('button', { name: 'Save' }).click();
  // The form says nothing was saved; the box's own message is linked to it (read out with the field).
  await expect(clock.getByRole('alert').filter({ hasText: 'Nothing was saved' })).toBeVisible();
  await expect(clock.getByLabel('Time zone (IANA)')).toHaveAccessibleDescription(/Not a known IANA time zone/);
  await clock.getByLabel('Time zone (IANA)').fill('Europe/Berlin');
  await clock.getByRole('button', { name: 'Save' }).click();
  await expect(clock.getByText('Saved.')).toBeVisible();
  const swap = page.getByRole('form', { name: 'One-off swap' });
  // 06:00 on the station's clock (Europe/Berlin, just saved) is a shift change.
  await swap.getByLabel('Shift starting').fill('2027-01-10T06:00');
  await expect(swap.getByTestId('station-time-zone')).toContainText('Station time — Europe/Berlin');
  await swap.getByLabel('Crew working it instead').selectOption({ label: 'Crew C' });
  await swap.getByLabel('Reason').fill('Crew A on training');
  await swap.getByRole('button', { name: 'Record swap' }).click();
  await expect(swap.getByText('Swap recorded.')).toBeVisible();
});
