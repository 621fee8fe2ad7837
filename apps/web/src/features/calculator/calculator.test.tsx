import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { json, mockApi, signedOut } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { StoredObservatory } from './api';

// The plots are drawn and checked in the browser test (e2e/calculator.e2e.test.ts). Under jsdom
// the chart package measures text through getComputedStyle, which makes every keystroke take
// seconds here; this test is about the form and the numbers, so the plots are left out.
vi.mock('./components/charts', () => ({ default: () => null }));

const C = 299_792_458; // m/s, exact (SI)

/** An invented array, as GET /api/observatories answers. */
const observatory: StoredObservatory = {
  id: 'o-1',
  name: 'Test Meadow Array',
  latitudeDeg: 47.3,
  longitudeDeg: -118.9,
  elevationM: 520,
  elevationLimitDeg: 15,
  antennas: 18,
  dishDiameterM: 16,
  correlatorEfficiency: 0.88,
  overheadFraction: 0.2,
  beamFactor: 1.13,
  timeZone: 'UTC',
  configurations: [
    {
      id: 'c-1',
      name: 'wide',
      shortestBaselineM: 120,
      longestBaselineM: 3200,
      inUseFrom: '2000-01-01',
      inUseTo: null,
    },
  ],
  bands: [
    {
      id: 'b-1',
      name: 'low band',
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

/** Opens the screen and waits for its lazily loaded module (slow the first time under jsdom). */
async function openCalculator(path = '/calculator') {
  mockApi({ 'GET /api/auth/me': signedOut(), 'GET /api/observatories': json([observatory]) });
  renderRoute(path);
  await screen.findByRole('heading', { level: 1, name: 'Calculator' }, { timeout: 10_000 });
}

/** The value cell of a quantity in the results table. */
const valueOf = (quantity: string) =>
  document.querySelector(`[data-quantity="${quantity}"]`)?.textContent ?? null;

const cm = (ghz: number) => ((C / (ghz * 1e9)) * 100).toPrecision(4);

// The first test pays for loading the screen's module and the chart package under jsdom.
describe('Calculator', { timeout: 30_000 }, () => {
  it('recomputes the numbers as a frequency is typed, and flags one outside the band', async () => {
    const user = userEvent.setup();
    await openCalculator();

    await waitFor(() => expect(valueOf('Wavelength')).toBe(cm(1.4)));
    expect(screen.getByRole('option', { name: /wide/ })).toBeInTheDocument();

    const frequency = screen.getByRole('textbox', { name: 'Sky frequency' });
    await user.clear(frequency);
    await user.type(frequency, '1.67');
    expect(valueOf('Wavelength')).toBe(cm(1.67));
    expect(valueOf('Sky frequency')).toBe('1.67');

    await user.selectOptions(screen.getByRole('combobox', { name: 'Frequency unit' }), 'MHz');
    await user.clear(frequency);
    await user.type(frequency, '2500');
    expect(valueOf('Wavelength')).toBe(cm(2.5));
    const checks = within(screen.getByRole('region', { name: 'Checks' }));
    expect(checks.getByText('Blocker')).toBeInTheDocument();
    expect(checks.getByText(/2\.5 GHz lies outside the band, 1–2 GHz/)).toBeInTheDocument();
  });

  it('shows a bad declination under its field and no numbers', async () => {
    const user = userEvent.setup();
    await openCalculator();
    await waitFor(() => expect(valueOf('Wavelength')).not.toBeNull());

    const dec = screen.getByRole('textbox', { name: 'Declination (ICRS)' });
    await user.clear(dec);
    await user.type(dec, '+95:00:00');

    expect(dec).toHaveAttribute('aria-invalid', 'true');
    expect(dec).toHaveAccessibleDescription(/at most 90/);
    expect(valueOf('Wavelength')).toBeNull();
    expect(screen.getByText(/One field needs a change/)).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/NaN|Infinity/);

    await user.clear(dec);
    expect(dec).toHaveAccessibleDescription(/Required/);
    await user.type(dec, '-12.5');
    expect(dec).not.toHaveAttribute('aria-invalid', 'true');
    // Culmination 90° − |φ − δ| = 90° − 59.8°.
    expect(valueOf('Highest elevation')).toBe('30.2');
  });

  it('takes its whole state from the link', async () => {
    await openCalculator(
      '/calculator?setup=custom&antennas=27&dishDiameterM=25&longestBaselineM=36000' +
        '&frequencyMode=line&restFrequency=1420.405751768&restUnit=MHz&shift=redshift&redshift=0.1' +
        '&time=90&timeUnit=min&rmsUnit=mJy&rmsGoal=0.01',
    );

    expect(await screen.findByRole('textbox', { name: 'Antennas' })).toHaveValue('27');
    expect(screen.getByRole('radio', { name: 'A spectral line' })).toBeChecked();
    expect(screen.getByRole('textbox', { name: 'Redshift z' })).toHaveValue('0.1');
    // ν = ν0 / (1 + z) for the H I line (Hellwig et al. 1970 rest frequency).
    await waitFor(() =>
      expect(valueOf('Sky frequency')).toBe(String(Number((1.420405751768 / 1.1).toPrecision(7)))),
    );
    expect(screen.getByRole('combobox', { name: 'Time unit' })).toHaveValue('min');
  });
});
