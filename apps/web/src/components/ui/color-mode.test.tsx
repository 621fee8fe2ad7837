import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { renderWithProviders } from '@/testing/render';
import { ColorModeButton } from './color-mode';

afterEach(() => document.documentElement.classList.remove('dark', 'light'));

describe('the colour mode toggle', () => {
  it('switches the page to dark and back, and remembers the choice', async () => {
    renderWithProviders(<ColorModeButton />);

    await userEvent.click(screen.getByRole('button', { name: 'Switch to dark mode' }));
    expect(document.documentElement).toHaveClass('dark');
    expect(document.documentElement.style.colorScheme).toBe('dark');
    expect(window.localStorage.getItem('skyhours-color-mode')).toBe('dark');

    await userEvent.click(screen.getByRole('button', { name: 'Switch to light mode' }));
    expect(document.documentElement).toHaveClass('light');
    expect(document.documentElement).not.toHaveClass('dark');
  });

  it('starts in the mode chosen before', () => {
    window.localStorage.setItem('skyhours-color-mode', 'dark');
    renderWithProviders(<ColorModeButton />);

    expect(screen.getByRole('button', { name: 'Switch to light mode' })).toBeInTheDocument();
    expect(document.documentElement).toHaveClass('dark');
  });
});
