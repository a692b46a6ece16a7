// A refused form must be heard, not only seen: each field's message is linked to its input
// (aria-invalid, aria-describedby naming the message's element) and the refusal itself is one alert.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { FieldMessage, FormFailure, useSchemaForm } from '../../src/components/form/schema-form';
import { ApiError } from '../../src/lib/api-client';

const schema = z.object({
  title: z.string().trim().min(1, 'Title is missing'),
  reason: z.string().trim().min(1, 'Why is missing'),
});

function ItemForm({ send }: { send: () => Promise<unknown> }) {
  const form = useSchemaForm(schema, { defaultValues: { title: '', reason: '' } });
  return (
    <form aria-label="Item" noValidate onSubmit={form.submit(send)}>
      <FormFailure form={form} />
      <label>
        Title
        <input {...form.register('title')} {...form.describe('title')} />
      </label>
      <FieldMessage {...form.messageFor('title')} />
      <label>
        Why
        <input {...form.register('reason')} {...form.describe('reason')} />
      </label>
      <FieldMessage {...form.messageFor('reason')} />
      <button type="submit">Save</button>
    </form>
  );
}

const described = (input: HTMLElement) => {
  const ids = input.getAttribute('aria-describedby')?.split(' ') ?? [];
  return ids.map((id) => document.getElementById(id)?.textContent ?? `(no element #${id})`).join(' ');
};

describe('form errors are linked to their fields and announced', () => {
  it('marks each refused field invalid, points it at its own message, and says once, as an alert, that nothing was saved', async () => {
    const user = userEvent.setup();
    let sent = 0;
    render(<ItemForm send={async () => sent++} />);
    const title = screen.getByLabelText('Title');
    const reason = screen.getByLabelText('Why');
    // Before a submit nothing is marked.
    expect(title.getAttribute('aria-invalid')).toBe('false');
    expect(title.hasAttribute('aria-describedby')).toBe(false);

    await user.type(reason, 'Pump swapped');
    await user.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByRole('alert')).toHaveProperty('textContent', expect.stringContaining('Nothing was saved'));
    expect(title.getAttribute('aria-invalid')).toBe('true');
    expect(described(title)).toBe('⚠ Title is missing');
    // The field that is fine is neither marked nor pointed at another field's message.
    expect(reason.getAttribute('aria-invalid')).toBe('false');
    expect(reason.hasAttribute('aria-describedby')).toBe(false);
    expect(screen.getAllByRole('alert')).toHaveLength(1);
    expect(sent).toBe(0);

    // Corrected: the link and the alert go.
    await user.type(title, 'CWP-B strainer');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(sent).toBe(1);
    expect(title.getAttribute('aria-invalid')).toBe('false');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it("puts the server's field message on its input, linked, with the server's refusal as the alert", async () => {
    const user = userEvent.setup();
    const refusal = new ApiError(400, 'VALIDATION', 'Some fields need attention', { title: 'Title is already used on this handover' });
    render(<ItemForm send={() => Promise.reject(refusal)} />);
    await user.type(screen.getByLabelText('Title'), 'Duplicate');
    await user.type(screen.getByLabelText('Why'), 'Test');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText(/Some fields need attention/)).toBeTruthy();
    const title = screen.getByLabelText('Title');
    expect(title.getAttribute('aria-invalid')).toBe('true');
    expect(described(title)).toBe('⚠ Title is already used on this handover');
  });
});
