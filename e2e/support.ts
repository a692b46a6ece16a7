import { expect, request, type Locator, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'hotwell-demo-2026';

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/**
 * Signs in and reads any standing orders the prompt puts in front of the person first (the demo has
 * orders for crew A), so the page behind it can be used. Waits for the prompt's own query, not a guess.
 */
export async function signInReadingOrders(page: Page, email: string) {
  const pending = page.waitForResponse((r) => r.url().endsWith('/api/me/pending-orders') && r.request().method() === 'GET');
  await signIn(page, email);
  const { orders } = (await (await pending).json()) as { orders: unknown[] };
  const dialog = page.getByRole('dialog', { name: 'Standing orders to acknowledge' });
  // One at a time, each gone before the next click: two quick clicks could both land on the first.
  const buttons = dialog.getByRole('button', { name: 'I have read this order' });
  for (let left = orders.length; left > 0; left--) {
    await buttons.first().click();
    await expect(buttons).toHaveCount(left - 1);
  }
  await expect(dialog).toHaveCount(0);
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
}

/** A demo person's API session, for setting the scene a test needs (not what it tests). */
export async function apiAs(baseURL: string, email: string) {
  const api = await request.newContext({ baseURL });
  const { csrfToken } = (await (await api.get('/api/session/csrf')).json()) as { csrfToken: string };
  const signedIn = await api.post('/api/session', { headers: { 'x-csrf-token': csrfToken }, data: { email, password: DEMO_PASSWORD } });
  expect(signedIn.ok()).toBe(true);
  const csrf = ((await signedIn.json()) as { csrfToken: string }).csrfToken;
  return { api, csrf };
}

/** The demo administrator's API session, for setting the scene a test needs (not what it tests). */
export async function adminApi(baseURL: string) {
  const api = await request.newContext({ baseURL });
  const { csrfToken } = (await (await api.get('/api/session/csrf')).json()) as { csrfToken: string };
  const signedIn = await api.post('/api/session', { headers: { 'x-csrf-token': csrfToken }, data: { email: 'admin@fernhollow.example', password: DEMO_PASSWORD } });
  expect(signedIn.ok()).toBe(true);
  const csrf = ((await signedIn.json()) as { csrfToken: string }).csrfToken;
  return { api, csrf };
}

/**
 * The handover window is set by the station (2 h either side of the change by default). A test that
 * submits and accepts at whatever time it runs opens it for the whole shift: the most a station may
 * set (before + after = the 12-hour shift), so the run does not depend on the time of day.
 */
export async function openHandoverWindowAllShift(baseURL: string) {
  const { api, csrf } = await adminApi(baseURL);
  const units = ((await (await api.get('/api/plant/units')).json()) as { units: { stationId: number }[] }).units;
  const stationId = units[0]!.stationId;
  const { settings } = (await (await api.get(`/api/stations/${stationId}/settings`)).json()) as { settings: Record<string, unknown> };
  const saved = await api.put(`/api/stations/${stationId}/settings`, { headers: { 'x-csrf-token': csrf }, data: { ...settings, handoverWindowBeforeMinutes: 720, handoverWindowAfterMinutes: 0 } });
  expect(saved.status(), await saved.text()).toBe(200);
  await api.dispose();
}

export type ShiftChangeNow = {
  unitId: number;
  /** The change that ends the shift in progress. */
  handoverAt: Date;
  /** Crew letters as the demo's e-mail addresses use them (operator.a@, lead.b@, …). */
  outgoing: string;
  incoming: string;
  /** Whether the outgoing crew has started this shift's handover draft already. */
  draftStarted: boolean;
  /** The active people of the incoming crew an e-mail on submit goes to. */
  incomingCrewEmails: string[];
};

/**
 * Which crews hand over on a unit now, as the server's rotation and clock say — not what the time
 * of day is expected to give — so a test can sign in the right people whenever it runs.
 */
export async function shiftChangeNow(baseURL: string, unitName = 'Unit 1'): Promise<ShiftChangeNow> {
  const { api } = await adminApi(baseURL);
  const units = ((await (await api.get('/api/plant/units')).json()) as { units: { id: number; name: string }[] }).units;
  const unitId = units.find((u) => u.name === unitName)!.id;
  const current = (await (await api.get(`/api/units/${unitId}/handovers/current`)).json()) as {
    shiftChange: { handoverAt: string; outgoingCrewId: number; incomingCrewId: number };
    board: unknown;
  };
  const crews = ((await (await api.get('/api/plant/crews')).json()) as { crews: { id: number; name: string }[] }).crews;
  const people = ((await (await api.get('/api/admin/users')).json()) as { users: { email: string; crewId: number | null; role: string; active: boolean }[] }).users;
  await api.dispose();
  const letter = (crewId: number) => crews.find((c) => c.id === crewId)!.name.toLowerCase();
  return {
    unitId,
    handoverAt: new Date(current.shiftChange.handoverAt),
    outgoing: letter(current.shiftChange.outgoingCrewId),
    incoming: letter(current.shiftChange.incomingCrewId),
    draftStarted: current.board !== null,
    incomingCrewEmails: people
      .filter((p) => p.active && p.crewId === current.shiftChange.incomingCrewId && ['trainee', 'operator', 'shift_lead'].includes(p.role))
      .map((p) => p.email)
      .sort(),
  };
}

/**
 * A test that must stay inside one shift (it hands the shift in progress over) and would run into
 * the shift change within `minutes` waits until the change has passed, then reads the crews again.
 */
export async function shiftChangeNotWithin(baseURL: string, minutes: number, unitName = 'Unit 1'): Promise<ShiftChangeNow> {
  const now = await shiftChangeNow(baseURL, unitName);
  const left = now.handoverAt.getTime() - Date.now();
  if (left > minutes * 60_000) return now;
  await new Promise((resolve) => setTimeout(resolve, left + 5_000));
  return shiftChangeNow(baseURL, unitName);
}

/**
 * Records, as `email`, a round with the same readings as the unit's latest one, taken now. For a test
 * that needs a round in the shift in progress when it runs just after a shift change, before the
 * demo's hourly rounds have reached the new shift; the same readings keep the unit's picture as it was.
 */
export async function repeatLastRound(baseURL: string, email: string, unitId: number) {
  const { api, csrf } = await apiAs(baseURL, email);
  const { readings } = (await (await api.get(`/api/units/${unitId}/readings?limit=1`)).json()) as { readings: { raw: Record<string, unknown> }[] };
  const { unitId: _unit, takenAt: _takenAt, ...raw } = readings[0]!.raw;
  const saved = await api.post(`/api/units/${unitId}/readings`, { headers: { 'x-csrf-token': csrf }, data: { ...raw, confirmOutsidePlausible: [] } });
  expect(saved.status(), await saved.text()).toBe(201);
  await api.dispose();
}

/** The signed-in person's name, as the page header shows it. */
export async function signedInName(page: Page): Promise<string> {
  const text = await page.getByTestId('signed-in-as').textContent();
  return text!.split(' · ')[0]!.trim();
}

/**
 * Types a round on the rounds form with the gauge in inHg vacuum and a barometer of 29.92 inHgA (the
 * way the demo's field operators read it), in °C and m³/h. Does not save.
 */
export async function typeVacuumRound(form: Locator, r: { vacuumInHg: string; hotwellC: string; cwInC: string; cwOutC: string; cwFlowM3h: string }) {
  await form.getByLabel('Pressure gauge').selectOption('inHg_vac');
  await form.getByLabel('Barometer', { exact: true }).fill('29.92');
  await form.getByLabel('Condenser vacuum').fill(r.vacuumInHg);
  await form.getByLabel('Hotwell temperature').fill(r.hotwellC);
  await form.getByLabel('CW inlet temperature').fill(r.cwInC);
  await form.getByLabel('CW outlet temperature').fill(r.cwOutC);
  await form.getByLabel('CW flow', { exact: true }).fill(r.cwFlowM3h);
}
