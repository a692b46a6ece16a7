// The main menu as a phone or tablet shows it: a button that opens the list of pages, closes again on
// Escape (the focus back on the button) and on following a link, and marks the page the person is on.
// happy-dom applies no stylesheet, so "open" is read from aria-expanded and the panel's display class.
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter, Route, Routes, useLocation } from 'react-router';
import { describe, expect, it } from 'vitest';
import { MainNav } from '../../src/app/layout/main-nav';
import { navigationGroupsFor } from '../../src/app/navigation';

function Where() {
  return <p data-testid="where">{useLocation().pathname}</p>;
}

function renderNav(role: Parameters<typeof navigationGroupsFor>[0], at = '/log') {
  render(
    <MemoryRouter initialEntries={[at]}>
      <MainNav groups={navigationGroupsFor(role)} linkTo={(to) => to} />
      <Routes>
        <Route path="*" element={<Where />} />
      </Routes>
    </MemoryRouter>,
  );
  const button = screen.getByRole('button', { name: 'Menu' });
  const panel = document.getElementById(button.getAttribute('aria-controls')!)!;
  return { button, panel, isOpen: () => button.getAttribute('aria-expanded') === 'true' && panel.classList.contains('grid') && !panel.classList.contains('hidden') };
}

describe('the main menu', () => {
  it('opens from its button and closes on Escape, giving the focus back to the button', async () => {
    const user = userEvent.setup();
    const { button, panel, isOpen } = renderNav('operator');
    expect(panel).not.toBeNull();
    expect(isOpen()).toBe(false);
    await user.click(button);
    expect(isOpen()).toBe(true);
    await user.tab();
    expect(panel.contains(document.activeElement)).toBe(true);
    await user.keyboard('{Escape}');
    expect(isOpen()).toBe(false);
    expect(document.activeElement).toBe(button);
  });

  it('closes when a page is chosen, and marks the page the person is on', async () => {
    const user = userEvent.setup();
    const { button, panel, isOpen } = renderNav('operator');
    await user.click(button);
    expect(within(panel).getByRole('link', { name: 'Shift log' }).getAttribute('aria-current')).toBe('page');
    await user.click(within(panel).getByRole('link', { name: 'Rounds' }));
    expect(screen.getByTestId('where').textContent).toBe('/rounds');
    expect(isOpen()).toBe(false);
    expect(within(panel).getByRole('link', { name: 'Rounds' }).getAttribute('aria-current')).toBe('page');
    expect(within(panel).getByRole('link', { name: 'Shift log' }).getAttribute('aria-current')).toBeNull();
  });

  it('groups the pages by what a shift does, with the Admin group for administrators only', () => {
    const groups = (role: Parameters<typeof navigationGroupsFor>[0]) => {
      const { panel } = renderNav(role);
      const names = within(panel).getAllByRole('group').map((g) => g.getAttribute('aria-labelledby')).map((id) => document.getElementById(id!)!.textContent);
      cleanup();
      return names;
    };
    expect(groups('operator')).toEqual(['The shift', 'The plant', 'Records', 'You']);
    expect(groups('admin')).toEqual(['The shift', 'The plant', 'Records', 'You', 'Admin']);
  });
});
