import { expect, test, type Page } from '@playwright/test';
import { openHandoverWindowAllShift, signIn } from './support';

async function openBoard(page: Page) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Handover', exact: true }).click();
}

async function acknowledgeEverything(page: Page) {
  const buttons = page.getByRole('button', { name: 'Acknowledge', exact: true });
  while ((await buttons.count()) > 0) {
    const before = await buttons.count();
    await buttons.first().click();
    await expect.poll(() => buttons.count()).toBeLessThan(before);
  }
}

test('outgoing writes, incoming acknowledges live, the incoming lead accepts', async ({ browser, baseURL }) => {
  test.setTimeout(90_000);
  await openHandoverWindowAllShift(baseURL!);
  const outgoing = await (await browser.newContext()).newPage();
  const incoming = await (await browser.newContext()).newPage();
  const lead = await (await browser.newContext()).newPage();

  // Demo rotation: crew A is on shift, crew B comes next.
  await signIn(incoming, 'operator.b@fernhollow.example');
  await openBoard(incoming);
  await signIn(outgoing, 'operator.a@fernhollow.example');
  await openBoard(outgoing);
  // Opening the board starts nothing; the outgoing crew starts the draft (an earlier test may have).
  const start = outgoing.getByRole('button', { name: 'Start this shift’s handover' });
  await expect(start.or(outgoing.getByTestId('handover-status'))).toBeVisible();
  if (await start.isVisible()) {
    await expect(incoming.getByText('has not started this shift’s handover')).toBeVisible();
    await start.click();
  }
  await expect(outgoing.getByTestId('handover-status')).toContainText('Draft');
  await expect(incoming.getByTestId('handover-status')).toContainText('Draft');
  // Beside the notes: the condenser over the shift so far, from the demo's rounds.
  await expect(outgoing.getByTestId('condenser-live')).toContainText('Condenser over the shift');
  await expect(outgoing.getByTestId('energy-lost')).toContainText('MWh');
  // Each board shows who else has it open.
  await expect(incoming.getByTestId('viewing')).toContainText('Cato Villanueva');
  await expect(incoming.getByTestId('viewing')).toContainText('Greta Ifeanyi');
  // Open flags and conditions come in by themselves.
  await expect(outgoing.getByRole('article', { name: /Item: 1-CWP-B out of service/ })).toBeVisible();

  const form = outgoing.getByRole('form', { name: 'Add a handover item' });
  await form.getByLabel('What').fill('Check 1-CWP-A bearing temperature every round');
  await form.getByLabel('Priority').selectOption('high');
  await form.getByRole('button', { name: 'Add item' }).click();
  // The incoming crew's board fills in without a reload.
  await expect(incoming.getByRole('article', { name: 'Item: Check 1-CWP-A bearing temperature every round' })).toBeVisible();

  await outgoing.getByRole('button', { name: 'Submit the handover' }).click();
  await expect(incoming.getByTestId('handover-status')).toContainText('Submitted');
  await expect(incoming.getByTestId('condenser-frozen')).toContainText('as handed over at');

  const item = incoming.getByRole('article', { name: 'Item: Check 1-CWP-A bearing temperature every round' });
  await item.getByRole('button', { name: 'Acknowledge' }).click();
  await expect(item.getByRole('button', { name: 'Acknowledge', exact: true })).toHaveCount(0);
  // The outgoing operator sees the acknowledgement without a reload.
  await expect(outgoing.getByRole('article', { name: 'Item: Check 1-CWP-A bearing temperature every round' })).toContainText('✔ Greta Ifeanyi');
  await acknowledgeEverything(incoming);

  await signIn(lead, 'lead.b@fernhollow.example');
  const pending = lead.getByRole('dialog', { name: 'Standing orders to acknowledge' });
  if (await pending.isVisible()) await pending.getByRole('button', { name: 'I have read this order' }).click();
  await openBoard(lead);
  await expect(lead.getByRole('button', { name: 'Accept the handover' })).toBeDisabled();
  await acknowledgeEverything(lead);
  await lead.getByRole('button', { name: 'Accept the handover' }).click();
  await expect(lead.getByTestId('turnover')).toContainText('Accepted by Femi Achterberg');
  await expect(outgoing.getByTestId('handover-status')).toContainText('Accepted');

  await lead.getByRole('link', { name: 'Print view' }).click();
  await expect(lead.getByRole('cell', { name: 'Femi Achterberg' })).toBeVisible();
  await expect(lead.getByRole('cell', { name: 'Cato Villanueva' })).toBeVisible();
  await expect(lead.getByRole('heading', { name: 'Shift handover — Fernhollow Station, Unit 1' })).toBeVisible();
  await expect(lead.getByTestId('print-header')).toContainText('Crew B — Femi Achterberg (shift lead)');
  await expect(lead.getByTestId('condenser-frozen')).toBeVisible();
});

test('the incoming crew got the submit e-mail, caught by the local fake', async ({ request }) => {
  const viewer = process.env.MAIL_VIEWER_URL;
  test.skip(!viewer, 'runs under npm test, which starts the mail catcher');
  const messages = (await (await request.get(`${viewer}/messages`)).json()) as { to: string[]; subject: string; text: string }[];
  const submitted = messages.find((m) => m.subject.startsWith('Handover for Unit 1 submitted'));
  expect(submitted).toBeDefined();
  // Crew B: its shift lead and operator; nobody from the outgoing crew A.
  expect(submitted!.to.sort()).toEqual(['lead.b@fernhollow.example', 'operator.b@fernhollow.example']);
  expect(submitted!.text).toContain('Check 1-CWP-A bearing temperature every round');
});
