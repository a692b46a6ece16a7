// The form wrapper's contract: a form whose values differ from the wire is checked by the shared schema itself,
// and every message (the contract's or the server's) lands on the form field that holds it, or is named by its label.
import { describe, expect, it } from 'vitest';
import { newConditionSchema } from '../../shared/schemas/log';
import { recordReadingSchema } from '../../shared/schemas/readings';
import { throughContract } from '../../src/components/form/schema-form';
import { applyServerErrors, otherFieldMessages } from '../../src/lib/form-errors';
import { emptyReadingForm, readingSetWire, roundFieldFor, type ReadingFormValues } from '../../src/components/readings/reading-form';
import { ApiError } from '../../src/lib/api-client';

type OpenValues = { title: string; hours: string; ownerId: string };
const openForm = throughContract(
  (v: OpenValues) => ({ title: v.title, requiredAction: 'Check the seal', startedAt: '2026-01-05T06:00:00Z', limitHours: Number(v.hours), ownerId: Number(v.ownerId) }),
  newConditionSchema,
  (path) => (path === 'limitHours' ? 'hours' : undefined),
);

const messagesOf = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((result.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('throughContract', () => {
  it('gives the wire shape when the shared schema accepts it', async () => {
    const parsed = (await openForm.load()).safeParse({ title: 'Seal leak on 1-CWP-B', hours: '72', ownerId: '4' });
    expect(parsed.success).toBe(true);
    expect(parsed.data).toMatchObject({ title: 'Seal leak on 1-CWP-B', limitHours: 72, ownerId: 4 });
  });

  it('puts the shared schema’s messages on the form fields, renamed where the form names them differently', async () => {
    const parsed = (await openForm.load()).safeParse({ title: 'x', hours: '0', ownerId: '' });
    expect(parsed.success).toBe(false);
    // The schema's own words (log.ts), on the box that holds each value.
    expect(messagesOf(parsed)).toEqual({ title: 'Name the condition', hours: 'Give the time allowed', ownerId: 'Choose the owner' });
  });

  it('keeps a conversion’s own message and does not stack the contract’s on the same field', async () => {
    const schema = throughContract(
      (v: { hours: string }, fail) => {
        if (!/^\d+$/.test(v.hours)) fail('hours', `“${v.hours}” is not a number`);
        return { title: 'Seal leak', requiredAction: 'Check the seal', startedAt: '2026-01-05T06:00:00Z', limitHours: Number(v.hours), ownerId: 4 };
      },
      newConditionSchema,
      (path) => (path === 'limitHours' ? 'hours' : undefined),
    );
    expect(messagesOf((await schema.load()).safeParse({ hours: '1O' }))).toEqual({ hours: '“1O” is not a number' });
  });

  it('maps a round’s contract paths onto its boxes (pressure.value → pressure)', async () => {
    const round = throughContract((v: ReadingFormValues) => {
      const { unitId: _unit, ...reading } = readingSetWire(1, v);
      return reading;
    }, recordReadingSchema, roundFieldFor);
    const values = { ...emptyReadingForm({ pressureUnit: 'kPa_a', temperatureUnit: 'degC', flowUnit: 'm3_h', barometerUnit: 'kPa_a' }), pressure: '6.5', cwInlet: '25', cwOutlet: '35' };
    const messages = messagesOf((await round.load()).safeParse(values));
    expect(Object.keys(messages)).toEqual(['hotwell']);
    expect(messages.hotwell).toBe('Hotwell temperature is missing');
  });
});

describe('server field errors', () => {
  const error = new ApiError(400, 'VALIDATION', 'Check the highlighted fields', { title: 'Name the condition', crewIds: 'Choose at least one', _: 'Nothing was saved' });

  it('sets the placed fields and returns the message for the form as a whole', () => {
    const set: Record<string, string> = {};
    const message = applyServerErrors(error, (field, e) => (set[String(field)] = e.message ?? ''), { placed: ['title'] });
    expect(set).toEqual({ title: 'Name the condition' });
    expect(message).toBe('Nothing was saved');
  });

  it('names the rest by their labels, never by their keys', () => {
    expect(otherFieldMessages(error, ['title'])).toEqual(['Crews: Choose at least one']);
  });

  it('places a contract path through the form’s mapping', () => {
    const set: Record<string, string> = {};
    const round = new ApiError(400, 'VALIDATION', 'Check the readings', { 'pressure.value': 'Condenser pressure is missing' });
    applyServerErrors(round, (field, e) => (set[String(field)] = e.message ?? ''), { placed: ['pressure'], fieldFor: roundFieldFor });
    expect(set).toEqual({ pressure: 'Condenser pressure is missing' });
    expect(otherFieldMessages(round, ['pressure'], roundFieldFor)).toEqual([]);
  });
});
