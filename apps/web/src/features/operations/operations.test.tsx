import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, json, makeSession, mockApi } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { Observatory } from './api';

const SLOW = { timeout: 8000 };
const staff = makeSession({ roles: ['staff'] });

const array: Observatory = {
  id: 'obs-1',
  name: 'Larkspur Valley Array',
  latitudeDeg: 47.3,
  longitudeDeg: -118.9,
  elevationM: 520,
  elevationLimitDeg: 15,
  antennas: 18,
  dishDiameterM: 16,
  correlatorEfficiency: 0.88,
  overheadFraction: 0.2,
  beamFactor: 1.13,
  timeZone: 'America/Los_Angeles',
  configurations: [
    {
      id: 'c-1',
      name: 'compact',
      shortestBaselineM: 30,
      longestBaselineM: 600,
      inUseFrom: '2027-02-01',
      inUseTo: null,
    },
  ],
  bands: [
    {
      id: 'b-1',
      name: 'L band',
      ieeeLetter: 'L',
      minGHz: 1,
      maxGHz: 2,
      tsysK: 28,
      apertureEfficiency: 0.65,
      maxBandwidthMHz: 1000,
      polarizations: [1, 2],
    },
  ],
};

describe('array setup', () => {
  it('is for staff only', async () => {
    mockApi({ 'GET /api/auth/me': json(makeSession()) });
    renderRoute('/operations/array');
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Not available to you' }, SLOW),
    ).toBeInTheDocument();
  });

  it('lists the configurations and bands in tables', async () => {
    mockApi({ 'GET /api/auth/me': json(staff), 'GET /api/observatories': json([array]) });
    renderRoute('/operations/array');
    const configurations = await screen.findByRole('table', { name: 'Configurations' }, SLOW);
    expect(
      within(configurations)
        .getAllByRole('row')
        .map((r) => r.textContent),
    ).toEqual([
      'NameShortest baselineLongest baselineIn use fromIn use untilActions',
      'compact30 m600 m2027-02-01further notice',
    ]);
    const bands = screen.getByRole('table', { name: 'Receiver bands' });
    expect(within(bands).getAllByRole('row')[1]?.textContent).toBe(
      'L bandL1–2 GHz28 K0.651,000 MHzSingle, Dual',
    );
  });

  it('checks the site form before sending, and shows the server’s issues under their fields', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json(staff),
      'GET /api/observatories': json([array]),
      'GET /api/auth/csrf': json({ token: 't' }),
      'PATCH /api/observatories/obs-1': apiError(400, 'VALIDATION_FAILED', 'Invalid', [
        { path: 'dishDiameterM', message: 'dishDiameterM must not be greater than 1000' },
      ]),
    });
    renderRoute('/operations/array');
    const user = userEvent.setup({ delay: null });
    const latitude = await screen.findByLabelText(/^Latitude/, {}, SLOW);
    await user.clear(latitude);
    await user.type(latitude, '91');
    await user.click(screen.getByRole('button', { name: 'Save the site' }));
    expect(await screen.findByText('Between -90 and 90')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.clear(latitude);
    await user.type(latitude, '47.4');
    await user.click(screen.getByRole('button', { name: 'Save the site' }));
    expect(
      await screen.findByText('dishDiameterM must not be greater than 1000'),
    ).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toMatchObject({
      latitudeDeg: 47.4,
      antennas: 18,
      timeZone: 'America/Los_Angeles',
    });
  });

  it('asks before removing a configuration and shows why the server refused', async () => {
    mockApi({
      'GET /api/auth/me': json(staff),
      'GET /api/observatories': json([array]),
      'GET /api/auth/csrf': json({ token: 't' }),
      'DELETE /api/observatories/obs-1/configurations/c-1': apiError(
        409,
        'IN_USE',
        'Configuration compact has hours on offer in a call; take it out of the call first',
      ),
    });
    renderRoute('/operations/array');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Remove compact' }, SLOW));
    const dialog = await screen.findByRole('alertdialog', { name: 'Remove compact?' });
    await user.click(within(dialog).getByRole('button', { name: 'Remove' }));
    expect(await within(dialog).findByText(/take it out of the call first/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
  });

  it('adds a configuration from its dialog', async () => {
    const { requests } = mockApi({
      'GET /api/auth/me': json(staff),
      'GET /api/observatories': json([array]),
      'GET /api/auth/csrf': json({ token: 't' }),
      'POST /api/observatories/obs-1/configurations': json(
        { ...array.configurations[0], id: 'c-2', name: 'extended' },
        201,
      ),
    });
    renderRoute('/operations/array');
    const user = userEvent.setup({ delay: null });
    await user.click(await screen.findByRole('button', { name: 'Add a configuration' }, SLOW));
    const dialog = within(await screen.findByRole('dialog', { name: 'Add a configuration' }));
    await user.type(dialog.getByLabelText(/^Name/), 'extended');
    await user.type(dialog.getByLabelText(/^Shortest baseline/), '120');
    await user.type(dialog.getByLabelText(/^Longest baseline/), '3200');
    await user.type(dialog.getByLabelText(/^In use from/), '2027-06-01');
    await user.click(dialog.getByRole('button', { name: 'Save' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
        name: 'extended',
        shortestBaselineM: 120,
        longestBaselineM: 3200,
        inUseFrom: '2027-06-01',
        inUseTo: null,
      }),
    );
  }, 20_000);
});
