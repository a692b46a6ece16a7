// Saving a new limit version: the page shows the new version in force, and the person who saved
// still sees that it was saved. The page redraws its forms when the versions in force change;
// the confirmation must survive that redraw, however quickly the refreshed setup arrives.
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { startingLimits } from '../../shared/calc/limits';
import { handBuiltDesign } from '../fixtures/hand-built-design';
import { widestPlausibleRanges } from '../fixtures/widest-plausible-ranges';
import { fakeServer } from './support/fake-server';
import { operator, renderAppAt, shellRoutes } from './support/render-app';

const admin = { ...operator, id: 1, name: 'Ada Admin', role: 'admin' as const, crewId: null, crewName: null, position: null };

function setupAnswer(limitVersion: number) {
  const row = (id: number) => ({ id, effectiveFrom: '2026-11-01T06:00:00.000Z', note: `version ${id}`, by: 'Ada Admin' });
  return {
    unit: { id: 1, code: 'U1', name: 'Unit 1' },
    design: { versionId: 1, data: handBuiltDesign },
    limits: { versionId: limitVersion, data: startingLimits },
    plausible: { versionId: null, data: widestPlausibleRanges },
    designHistory: [row(1)],
    limitHistory: Array.from({ length: limitVersion }, (_, i) => row(limitVersion - i)),
    plausibleHistory: [],
    equipment: [],
  };
}

describe('the plant setup page after a save', () => {
  it('keeps “Saved as a new version” in view after the page shows the new version', async () => {
    let limitVersion = 1;
    const server = fakeServer({
      ...shellRoutes(admin),
      'GET /api/plant/units/1/setup': () => ({ body: setupAnswer(limitVersion) }),
      'POST /api/plant/units/1/limit-versions': () => {
        limitVersion += 1;
        return { status: 201, body: { versionId: limitVersion } };
      },
    });
    const user = userEvent.setup();
    renderAppAt('/plant?unit=1');
    const form = within(await screen.findByRole('form', { name: 'Limit set' }, { timeout: 5000 }));
    await user.type(form.getByLabelText('What changed and why'), 'Tighter TTD watch');
    await user.click(form.getByRole('button', { name: 'Save limits as a new version' }));

    // The refreshed setup names version 2 in force ...
    await waitFor(() => expect(screen.getByText(/· version 2/)).toBeTruthy());
    expect(server.writes()).toHaveLength(1);
    // ... and the confirmation is still there, in the redrawn form.
    const redrawn = within(screen.getByRole('form', { name: 'Limit set' }));
    expect(redrawn.getByText(/Saved as a new version/)).toBeTruthy();
  });
});
