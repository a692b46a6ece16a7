// A form whose contract is fetched on demand (src/components/form/lazy-contract.ts): when that
// fetch fails (the connection dropped before the page's checks arrived), a submit says so on the
// form and sends nothing, rather than failing silently.
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { FormFailure, useSchemaForm } from '../../src/components/form/schema-form';
import { lazyContract } from '../../src/components/form/lazy-contract';

function NoteForm({ load, send }: { load: () => Promise<z.ZodType<{ note: string }, { note: string }>>; send: (v: { note: string }) => void }) {
  const form = useSchemaForm(lazyContract(load), { defaultValues: { note: '' } });
  return (
    <form aria-label="Note" noValidate onSubmit={form.submit(send)}>
      <FormFailure form={form} />
      <input aria-label="Note" {...form.register('note')} />
      <button type="submit">Save</button>
    </form>
  );
}

describe('a form whose contract could not be fetched', () => {
  it('says so on the form and sends nothing', async () => {
    const send = vi.fn();
    const load = () => Promise.reject(new TypeError('Failed to fetch dynamically imported module'));
    render(<NoteForm load={load} send={send} />);
    const user = userEvent.setup();
    await user.type(screen.getByRole('textbox', { name: 'Note' }), 'Backwash done');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText(/could not be loaded.*nothing was saved/i)).toBeTruthy();
    expect(send).not.toHaveBeenCalled();
  });

  it('checks and sends once the contract is there', async () => {
    const send = vi.fn();
    render(<NoteForm load={async () => z.object({ note: z.string().min(1, 'Write the note') })} send={send} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Save' }));
    // The note's own message goes beside its box (the page's to show); the form's summary says nothing was saved.
    expect(await screen.findByText(/Nothing was saved/)).toBeTruthy();
    expect(send).not.toHaveBeenCalled();
    await user.type(screen.getByRole('textbox', { name: 'Note' }), 'Backwash done');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    await vi.waitFor(() => expect(send).toHaveBeenCalledWith({ note: 'Backwash done' }));
  });
});
