// Renders the whole app (its providers, router and shell) at an address, as a browser opening
// that page would: only `fetch` (see fake-server.ts) and the live socket are stand-ins.
import { render } from '@testing-library/react';
import { AppProviders } from '../../../src/app/providers';
import type { PublicUser } from '../../../shared/schemas/auth';
import type { UnitSummary } from '../../../shared/schemas/plant';

export function renderAppAt(path: string) {
  window.history.replaceState(null, '', path);
  return render(<AppProviders />);
}

export const operator: PublicUser = {
  id: 7,
  name: 'Ola Operator',
  email: 'ola@test.example',
  role: 'operator',
  crewId: 1,
  crewName: 'A',
  position: 'field',
  active: true,
  mustChangePassword: false,
  version: 1,
};

export const unit1: UnitSummary = { id: 1, code: 'U1', name: 'Unit 1', stationId: 1, station: 'Test Station', timeZone: 'Europe/Berlin' };

/** What the shell asks for on every page of a signed-in person with nothing waiting. */
export const shellRoutes = (me: PublicUser = operator) => ({
  'GET /api/me': { body: { user: me } },
  'GET /api/me/pending-orders': { body: { orders: [] } },
  'GET /api/session/csrf': { body: { csrfToken: 'test-token' } },
  'GET /api/plant/units': { body: { units: [unit1] } },
});
