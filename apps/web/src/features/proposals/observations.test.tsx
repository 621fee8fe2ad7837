import {
  CoordinateParseError,
  evaluateObservation,
  parseRightAscension,
  type ObservationInput as CalcInput,
} from '@skyhours/calc';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';
import { json, makeSession, mockApi, type MockRequest } from '@/testing/mock-api';
import { renderRoute } from '@/testing/render';
import type { ImportPreview, Observation, Proposal } from './api';
import { formatNumber } from './format';
import { BASE, REFERENCE, makeProposal, noChecks, observatory, target } from './testing/fixtures';

const SLOW = { timeout: 10_000 };
const TEST_TIMEOUT = 30_000;

beforeEach(() => resetCsrfToken());

/** A target wide enough to need a mosaic, so the hours asked are shared among pointings. */
const wide = { ...target, extentArcsec: 3000 };

function serve(
  proposal: Proposal,
  handlers: Record<string, (request: MockRequest) => Response> = {},
) {
  return mockApi({
    'GET /api/auth/me': json(makeSession()),
    'GET /api/auth/csrf': json({ token: 't' }),
    [`GET ${BASE}`]: json(proposal),
    [`GET ${BASE}/checks`]: json(noChecks),
    [`GET /api/observatories/${observatory.id}`]: json(observatory),
    ...handlers,
  });
}

const band = observatory.bands[0]!;
const configuration = observatory.configurations[1]!;

/**
 * What the library says for the form's input, worked out here on its own: the hours asked cover
 * every pointing and the overhead, so one pointing gets hours / (pointings × (1 + overhead)).
 */
function expected(frequencyGHz: number, hoursAsked: number) {
  const input: CalcInput = {
    array: {
      antennas: observatory.antennas,
      dishDiameterM: observatory.dishDiameterM,
      latitudeDeg: observatory.latitudeDeg,
      longitudeDeg: observatory.longitudeDeg,
      elevationLimitDeg: observatory.elevationLimitDeg,
      correlatorEfficiency: observatory.correlatorEfficiency,
      overheadFraction: observatory.overheadFraction,
      beamFactor: observatory.beamFactor,
    },
    configuration: {
      shortestBaselineM: configuration.shortestBaselineM,
      longestBaselineM: configuration.longestBaselineM,
    },
    band: {
      minGHz: band.minGHz,
      maxGHz: band.maxGHz,
      tsysK: band.tsysK,
      apertureEfficiency: band.apertureEfficiency,
      maxBandwidthMHz: band.maxBandwidthMHz,
    },
    frequencyGHz,
    bandwidthMHz: 500,
    polarizations: 2,
    target: {
      raDeg: wide.raDeg,
      decDeg: wide.decDeg,
      extentArcsec: wide.extentArcsec,
      resolutionGoalArcsec: null,
    },
    rmsGoalMicroJy: 20,
    onSourceHours: null,
  };
  const { pointings } = evaluateObservation(input);
  const onSourceHours = hoursAsked / (pointings * (1 + observatory.overheadFraction));
  return { ...evaluateObservation({ ...input, onSourceHours }), onSourceHours };
}

const quantity = (name: string) => document.querySelector(`[data-quantity="${name}"]`)?.textContent;

async function replace(field: HTMLElement, value: string) {
  await userEvent.clear(field);
  await userEvent.type(field, value);
}

describe('the observation form', () => {
  it(
    'shows the calculator’s numbers live, as the hours and the frequency change',
    async () => {
      const proposal = makeProposal({ targets: [wide] });
      const created: Observation[] = [];
      const api = serve(proposal, {
        [`POST ${BASE}/observations`]: ({ body }) => {
          const sent = body as Omit<Observation, 'id' | 'result' | 'checks'> & { version: number };
          const result = expected(sent.frequencyGHz ?? 0, sent.hoursAsked);
          const { version: _, ...fields } = sent;
          created.push({ ...fields, id: 'o-1', result, checks: result.checks });
          return json({ ...proposal, version: 8, observations: created });
        },
      });
      renderRoute(`/proposals/${REFERENCE}/observations`);
      const add = await screen.findByRole('button', { name: 'Add an observation' }, SLOW);
      await waitFor(() => expect(add).toBeEnabled());
      await userEvent.click(add);

      const form = within(screen.getByRole('form', { name: 'Add an observation' }));
      await userEvent.selectOptions(form.getByRole('combobox', { name: /Receiver band/ }), band.id);
      await userEvent.selectOptions(
        form.getByRole('combobox', { name: /Configuration/ }),
        configuration.id,
      );
      await userEvent.type(form.getByRole('textbox', { name: /Sky frequency/ }), '1.4');
      await userEvent.type(form.getByRole('textbox', { name: /Bandwidth/ }), '500');
      await userEvent.type(form.getByRole('textbox', { name: /Rms goal/ }), '20');
      const hours = form.getByRole('textbox', { name: /Hours asked/ });
      await userEvent.type(hours, '10');

      const first = expected(1.4, 10);
      expect(first.pointings).toBeGreaterThan(1);
      expect(quantity('pointings')).toBe(String(first.pointings));
      expect(quantity('on-source')).toBe(`${formatNumber(first.onSourceHours)} h`);
      expect(quantity('rms')).toBe(`${formatNumber(first.rmsMicroJy)} µJy (goal 20 µJy)`);

      await replace(hours, '20');
      const more = expected(1.4, 20);
      expect(quantity('rms')).toBe(`${formatNumber(more.rmsMicroJy)} µJy (goal 20 µJy)`);
      expect(more.rmsMicroJy).toBeLessThan(first.rmsMicroJy!);

      await replace(form.getByRole('textbox', { name: /Sky frequency/ }), '1.6');
      const higher = expected(1.6, 20);
      expect(quantity('sky-frequency')).toBe(`${formatNumber(1.6, 6)} GHz`);
      expect(quantity('resolution')).toBe(`${formatNumber(higher.resolutionArcsec)}″`);
      expect(quantity('rms')).toBe(`${formatNumber(higher.rmsMicroJy)} µJy (goal 20 µJy)`);
      // Each of the library's findings, in its words, with its level in words.
      expect(higher.checks.length).toBeGreaterThan(0);
      for (const check of higher.checks) {
        const item = screen.getByText(check.message).closest('[data-check]');
        expect(item).toHaveAttribute('data-level', check.level);
        expect(item).toHaveTextContent(new RegExp(`^(Blocker|Warning|Note)`));
      }

      await userEvent.click(form.getByRole('button', { name: 'Add the observation' }));
      await waitFor(() => expect(created).toHaveLength(1));
      expect(
        api.requests.find((r) => r.method === 'POST' && r.path.endsWith('/observations'))?.body,
      ).toEqual({
        version: 7,
        targetId: wide.id,
        bandId: band.id,
        configurationId: configuration.id,
        frequencyGHz: 1.6,
        bandwidthMHz: 500,
        spectralResolutionKHz: null,
        polarizations: 2,
        rmsGoalMicroJy: 20,
        resolutionGoalArcsec: null,
        hoursAsked: 20,
      });
      // The table shows the numbers the server stored.
      const table = await screen.findByRole('table', { name: 'Observations' });
      expect(within(table).getByText(`${formatNumber(higher.rmsMicroJy)} µJy`)).toBeInTheDocument();
      expect(within(table).getByText('20.0 h')).toBeInTheDocument();
      expect(screen.queryByRole('form', { name: 'Add an observation' })).not.toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );
});

describe('the target form', () => {
  it(
    'reads the coordinates as they are typed and names what is wrong in the parser’s words',
    async () => {
      serve(makeProposal({ targets: [] }));
      renderRoute(`/proposals/${REFERENCE}/observations`);
      await userEvent.click(await screen.findByRole('button', { name: 'Add a target' }, SLOW));
      const ra = screen.getByRole('textbox', { name: /Right ascension/ });

      await userEvent.type(ra, '10:00:24');
      expect(
        screen.getByText(`Read as 10:00:24.00 = ${formatNumber(150.1, 7)}°`),
      ).toBeInTheDocument();

      await replace(ra, '25:00:00');
      let message = '';
      try {
        parseRightAscension('25:00:00');
      } catch (error) {
        if (error instanceof CoordinateParseError) message = error.message;
      }
      expect(message).not.toBe('');
      expect(screen.getByText(message)).toBeInTheDocument();
      expect(ra).toHaveAttribute('aria-invalid', 'true');
    },
    TEST_TIMEOUT,
  );
});

describe('the CSV import', () => {
  const good = 'Quince Cloud,10:00:24,+22:30:00,30,,,,,';
  const bad = 'Pear Ring,11:00:00,+95:00:00,0,,,,,';
  const header = 'name,ra,dec,extent_arcsec,flux_mjy,rest_ghz,velocity_km_s,convention,redshift';

  it(
    'previews each row with its problems and imports only when none has one',
    async () => {
      const proposal = makeProposal({ targets: [] });
      const answer = (csv: string): ImportPreview => {
        const rows = csv
          .trim()
          .split('\n')
          .slice(1)
          .map((line, index) => {
            const [name] = line.split(',');
            const broken = line.includes('+95');
            return {
              line: index + 2,
              name: name ?? null,
              raDeg: 150,
              decDeg: broken ? null : 22.5,
              errors: broken
                ? [{ column: 'dec', message: 'Declination must lie within ±90°, got +95°.' }]
                : [],
            };
          });
        const invalid = rows.filter((row) => row.errors.length > 0).length;
        return { rows, valid: rows.length - invalid, invalid };
      };
      const api = serve(proposal, {
        [`POST ${BASE}/targets/import`]: ({ body }) => {
          const { csv, dryRun } = body as { csv: string; dryRun: boolean };
          return dryRun
            ? json(answer(csv))
            : json({
                ...proposal,
                version: 8,
                targets: [{ ...target, id: 't-9', name: 'Quince Cloud' }],
              });
        },
      });
      renderRoute(`/proposals/${REFERENCE}/observations`);
      await userEvent.click(await screen.findByRole('button', { name: 'Import from CSV' }, SLOW));

      const text = screen.getByRole('textbox', { name: 'CSV text' });
      await userEvent.click(text);
      await userEvent.paste(`${header}\n${good}\n${bad}`);
      await userEvent.click(screen.getByRole('button', { name: 'Preview the rows' }));

      expect(
        await screen.findByText('dec: Declination must lie within ±90°, got +95°.'),
      ).toBeInTheDocument();
      expect(screen.getByText('1 row with problems')).toBeInTheDocument();
      const importButton = screen.getByRole('button', { name: 'Import 1 target' });
      expect(importButton).toBeDisabled();
      expect(screen.getByText(/1 row has problems: correct it in the text/)).toBeInTheDocument();
      const imports = () => api.requests.filter((r) => r.path.endsWith('/targets/import'));
      expect(imports()[0]?.body).toEqual({
        version: 7,
        csv: `${header}\n${good}\n${bad}`,
        dryRun: true,
      });

      // Corrected, the text needs a new preview before it can be imported.
      await userEvent.clear(text);
      await userEvent.click(text);
      await userEvent.paste(`${header}\n${good}`);
      expect(screen.getByText(/The text changed since the preview/)).toBeInTheDocument();
      await userEvent.click(screen.getByRole('button', { name: 'Preview the rows' }));
      const ready = await screen.findByRole('button', { name: 'Import 1 target' });
      await waitFor(() => expect(ready).toBeEnabled());

      await userEvent.click(ready);
      await waitFor(() => expect(imports()).toHaveLength(3));
      expect(imports()[2]?.body).toEqual({ version: 7, csv: `${header}\n${good}`, dryRun: false });
      const table = await screen.findByRole('table', { name: 'Targets' });
      expect(within(table).getByText('Quince Cloud')).toBeInTheDocument();
    },
    TEST_TIMEOUT,
  );
});
