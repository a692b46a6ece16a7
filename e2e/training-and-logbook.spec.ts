import { expect, test, type Browser } from '@playwright/test';
import { signIn } from './support';

async function as(browser: Browser, email: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email);
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
  return { page, close: () => context.close() };
}

test('a trainee records practice, an operator countersigns, the trainer signs off, and the matrix shows it', async ({ browser }) => {
  const trainee = await as(browser, 'trainee.a@fernhollow.example');
  await trainee.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Training' }).click();
  const form = trainee.page.getByRole('form', { name: 'Record a practice' });
  // The form shows the server's field messages.
  await form.getByRole('button', { name: 'Record practice' }).click();
  await expect(form.getByText('Choose a task')).toBeVisible();
  for (const note of ['Backwashed waterbox A on Unit 1 with the operator', 'Backwashed waterbox B on Unit 2; ΔP recorded before and after']) {
    await form.getByLabel('Task').selectOption('CW-02');
    await form.getByLabel('Level').selectOption('supervised');
    await form.getByLabel('What you did').fill(note);
    await form.getByRole('button', { name: 'Record practice' }).click();
    await expect(trainee.page.getByTestId('training-entry').filter({ hasText: note })).toContainText('awaiting countersign');
  }
  await expect(trainee.page.getByTestId('task-row-CW-02')).toContainText('In progress');

  const operator = await as(browser, 'operator.a@fernhollow.example');
  await operator.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Training' }).click();
  for (const note of ['Backwashed waterbox A on Unit 1', 'Backwashed waterbox B on Unit 2']) {
    const entry = operator.page.getByTestId('countersign-entry').filter({ hasText: note });
    await entry.getByRole('button', { name: 'Countersign' }).click();
    await expect(entry).toHaveCount(0);
  }
  await operator.close();

  const trainer = await as(browser, 'trainer@fernhollow.example');
  await trainer.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Training' }).click();
  await trainer.page.getByTestId('ready-task').filter({ hasText: 'CW-02' }).getByRole('link').click();
  const row = trainer.page.getByTestId('task-row-CW-02');
  await expect(row).toContainText('Ready for sign-off');
  await row.getByLabel('Trainer’s comments').fill('Both backwashes to the standard; watched backpressure throughout.');
  await row.getByRole('button', { name: 'Sign off' }).click();
  await expect(row).toContainText('Signed off');
  await expect(row).toContainText('signed against v1');

  // The trainee's own matrix shows it (refetched on navigation).
  await trainee.page.reload();
  await expect(trainee.page.getByTestId('task-row-CW-02')).toContainText('Signed off');
  await expect(trainee.page.getByTestId('task-row-CW-02')).toContainText('Both backwashes to the standard');
  await trainer.close();
  await trainee.close();
});

test('the trainer opens a past shift from the logbook and comments; the trainee sees the comment', async ({ browser }) => {
  const trainer = await as(browser, 'trainer@fernhollow.example');
  await trainer.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Logbook history' }).click();
  await trainer.page.getByLabel('Words to find').fill('hotwell level creeping');
  await trainer.page.getByRole('button', { name: 'Search' }).click();
  const hit = trainer.page.getByTestId('search-hit').filter({ hasText: 'Level controller found in manual' });
  await expect(hit).toContainText('exact phrase');
  await hit.getByRole('link', { name: 'Open the shift as it was' }).click();
  await expect(trainer.page.getByRole('heading', { level: 1 })).toContainText('Unit 1: shift');
  await expect(trainer.page.getByText('read-only record')).toBeVisible();
  const record = trainer.page.getByRole('article').filter({ hasText: 'Level controller found in manual' });
  await record.getByRole('button', { name: 'Add a review comment' }).click();
  await record.getByLabel('Review comment').fill('Good report. Next time also ask for the controller mode in the round sheet.');
  await record.getByRole('button', { name: 'Save comment' }).click();
  await expect(record.getByTestId('review-comment')).toContainText('ask for the controller mode');
  await trainer.close();

  const trainee = await as(browser, 'trainee.a@fernhollow.example');
  await trainee.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Training' }).click();
  const comment = trainee.page.getByTestId('my-review-comment').filter({ hasText: 'ask for the controller mode' });
  await expect(comment).toContainText('Evander Sköld');
  await comment.getByRole('link', { name: 'Open that shift' }).click();
  await expect(trainee.page.getByRole('article').filter({ hasText: 'Level controller found in manual' }).getByTestId('review-comment')).toBeVisible();
  // Trainees read the logbook but do not comment.
  await expect(trainee.page.getByRole('button', { name: 'Add a review comment' })).toHaveCount(0);

  // Practice can be recorded from the shift it came from, and keeps the link.
  await trainee.page.getByRole('link', { name: 'Record as training practice' }).first().click();
  await expect(trainee.page.getByTestId('practice-link')).toContainText('Linked to the shift');
  const form = trainee.page.getByRole('form', { name: 'Record a practice' });
  await form.getByLabel('Task').selectOption('CT-02');
  await form.getByLabel('What you did').fill('Reported the hotwell level creeping up and followed the controller check');
  await form.getByRole('button', { name: 'Record practice' }).click();
  await expect(trainee.page.getByTestId('training-entry').filter({ hasText: 'followed the controller check' })).toContainText('From the shift of');
  await trainee.close();
});
