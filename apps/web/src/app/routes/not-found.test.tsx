import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { json, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';

describe('unknown addresses', () => {
  it('show the not-found page inside the frame, with the address and a way back', async () => {
    mockApi({
      'GET /api/auth/me': signedOut(),
      'GET /api/health': json({ status: 'ok', database: 'up', mail: 'up', version: '1' }),
    });
    renderRoute('/no/such/screen');

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Page not found' }),
    ).toBeInTheDocument();
    expect(screen.getByText('/no/such/screen')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to the Desk' })).toHaveAttribute('href', '/');
    // The header and navigation stay, so the user is not stranded.
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeInTheDocument();
    await waitFor(() => expect(document.title).toBe('Page not found · Skyhours'));
  });
});
