// The round form as an operator uses it: the checks follow each keystroke, in the units typed,
// and a refusal from the server lands beside the box it is about.
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { startingLimits } from '../../shared/calc/limits';
import { handBuiltDesign } from '../fixtures/hand-built-design';
import { widestPlausibleRanges } from '../fixtures/widest-plausible-ranges';
import { fakeServer } from './support/fake-server';
import { renderAppAt, shellRoutes } from './support/render-app';

const roundsRoutes = () => ({
  ...shellRoutes(),
  'GET /api/calc/units/1/condenser-design': { body: { design: handBuiltDesign, limits: startingLimits, plausible: widestPlausibleRanges } },
  'GET /api/units/1/readings': { body: { readings: [] } },
});

/** A check in the results, by its label: the value with its unit as shown, and the status word. */
async function check(label: RegExp) {
  const cells = within(await screen.findByRole('row', { name: label })).getAllByRole('cell');
  const text = (i: number) => (cells[i]?.textContent ?? '').replace(/\s+/g, ' ').trim();
  return { value: text(1), status: text(2).replace(/^[●▲◆○]\s*/, '') };
}

async function openRoundForm() {
  renderAppAt('/rounds?unit=1');
  // The first test pays for loading the page's code on demand (its chunk and the offline queue's), seconds on a busy machine.
  const form = await screen.findByRole('form', { name: 'Record a round' }, { timeout: 5000 });
  return within(form);
}

describe('the round form’s live evaluation', () => {
  it('shows saturation temperature, subcooling and TTD with their units and statuses as values are typed', async () => {
    fakeServer(roundsRoutes());
    const user = userEvent.setup();
    const form = await openRoundForm();
    await user.type(form.getByLabelText('Condenser absolute pressure'), '10');
    await user.type(form.getByLabelText('Hotwell temperature'), '45');
    await user.type(form.getByLabelText('CW inlet temperature'), '30');
    await user.type(form.getByLabelText('CW outlet temperature'), '40');

    // IAPWS-IF97 saturation table: Ts(10 kPa) = 318.957 K = 45.81 °C (shown to 0.1 °C).
    expect(await check(/^Saturation temperature/)).toEqual({ value: '45.8 °C', status: 'Normal' });
    // Subcooling = Ts − hotwell = 45.81 − 45 = 0.81 K; TTD = Ts − CW out = 45.81 − 40 = 5.81 K, under the 7 K watch limit.
    expect(await check(/^Condensate subcooling/)).toEqual({ value: '0.81 K', status: 'Normal' });
    expect(await check(/^Terminal temperature difference/)).toEqual({ value: '5.81 K', status: 'Normal' });

    // One more keystroke's worth of change: CW out 37 °C → TTD 8.81 K, over the 7 K watch limit.
    await user.clear(form.getByLabelText('CW outlet temperature'));
    await user.type(form.getByLabelText('CW outlet temperature'), '37');
    await waitFor(async () => expect(await check(/^Terminal temperature difference/)).toEqual({ value: '8.81 K', status: 'Watch' }));
  });

  it('converts a pressure typed in bar and shows temperatures in the kelvin chosen', async () => {
    fakeServer(roundsRoutes());
    const user = userEvent.setup();
    const form = await openRoundForm();
    await user.selectOptions(form.getByLabelText('Pressure gauge'), 'bar_a');
    await user.selectOptions(form.getByLabelText('Temperatures'), 'K');
    await user.type(form.getByLabelText('Condenser absolute pressure'), '1');
    await user.type(form.getByLabelText('Hotwell temperature'), '372');
    await user.type(form.getByLabelText('CW inlet temperature'), '350');
    await user.type(form.getByLabelText('CW outlet temperature'), '360');

    // IAPWS-IF97, Table 35 (verification values of the saturation-temperature equation):
    // p = 0.1 MPa (1 bar) → Ts = 372.755919 K, shown to 0.1 K.
    expect((await check(/^Saturation temperature/)).value).toBe('372.8 K');
    // Subcooling = 372.756 − 372 = 0.76 K.
    expect((await check(/^Condensate subcooling/)).value).toBe('0.76 K');
    // The measured pressure is shown back in the unit typed.
    expect((await check(/^Condenser absolute pressure/)).value).toBe('1.0000 bar a');
  });
});

describe('the round form’s server refusals', () => {
  it('puts each field message from a 400 beside its own box, and none beside the others', async () => {
    const server = fakeServer({
      ...roundsRoutes(),
      'POST /api/units/1/readings': {
        status: 400,
        body: {
          error: {
            code: 'VALIDATION',
            message: 'Some readings were refused',
            fields: {
              'hotwellTemperature.value': 'Hotwell temperature is above the saturation temperature by more than the gauge error',
              'cwFlow.value': 'CW flow must be above zero',
            },
          },
        },
      },
    });
    const user = userEvent.setup();
    const form = await openRoundForm();
    await user.type(form.getByLabelText('Condenser absolute pressure'), '10');
    await user.type(form.getByLabelText('Hotwell temperature'), '45');
    await user.type(form.getByLabelText('CW inlet temperature'), '30');
    await user.type(form.getByLabelText('CW outlet temperature'), '40');
    await user.type(form.getByRole('textbox', { name: 'CW flow' }), '54000');
    await user.click(form.getByRole('button', { name: 'Save round' }));

    const hotwell = await form.findByRole('textbox', { name: 'Hotwell temperature', description: /above the saturation temperature/ });
    expect(hotwell.getAttribute('aria-invalid')).toBe('true');
    expect(form.getByRole('textbox', { name: 'CW flow', description: /CW flow must be above zero/ })).toBeTruthy();
    for (const other of ['Condenser absolute pressure', 'CW inlet temperature', 'CW outlet temperature']) {
      const box = form.getByRole('textbox', { name: other });
      expect(box.getAttribute('aria-invalid'), other).toBe('false');
      expect(box.getAttribute('aria-describedby'), other).toBeNull();
    }
    // What was sent: the values as typed, with their units.
    const sent = server.writes().find((c) => c.path === '/api/units/1/readings')?.body;
    expect(sent).toMatchObject({ pressure: { value: 10, unit: 'kPa_a' }, hotwellTemperature: { value: 45, unit: 'degC' }, cwFlow: { value: 54000, unit: 'm3_h' } });
  });
});
