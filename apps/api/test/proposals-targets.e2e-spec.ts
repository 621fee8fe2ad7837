import Papa from 'papaparse';
import { parseDeclination, parseRightAscension } from '@skyhours/calc';
import type { Call } from '../src/calls/entities/call.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import type { TestObservatory } from './support/calls-factories.js';
import {
  createProposal,
  makeOpenCall,
  must,
  observationOf,
  type ProposalBody,
  signedIn,
} from './support/proposal-factories.js';

interface Target {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
  extentArcsec: number;
  fluxDensityMJy: number | null;
  line: Record<string, unknown> | null;
}
const targets = (p: ProposalBody) => p.targets as Target[];

describe('proposals: targets', () => {
  let t: TestApp;
  let array: TestObservatory;
  let call: Call;
  let pi: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    ({ array, call } = await makeOpenCall(t.dataSource));
    pi = (await signedIn(t)).agent;
  });
  afterAll(() => t.close());

  const fresh = async () => {
    const p = await createProposal(pi, call.code);
    return { p, base: `/api/proposals/${p.reference}` };
  };

  it('adds targets in sexagesimal or decimal degrees, as the calculator library parses them', async () => {
    const fresh_ = await fresh();
    const base = fresh_.base;
    let p = fresh_.p;
    p = await must(
      pi.post(`${base}/targets`, {
        version: p.version,
        name: 'Sexagesimal source',
        ra: '10h00m24.0s',
        dec: '-05:04:03.2',
        extentArcsec: 120,
        fluxDensityMJy: 3.5,
        line: { restGHz: 1.420405751768, velocityKmS: 1250, convention: 'optical' },
      }),
      201,
    );
    p = await must(
      pi.post(`${base}/targets`, {
        version: p.version,
        name: 'Decimal source',
        ra: '150.1',
        dec: '22.5',
      }),
      201,
    );
    expect(targets(p)).toEqual([
      {
        id: expect.any(String),
        name: 'Sexagesimal source',
        raDeg: parseRightAscension('10h00m24.0s'),
        decDeg: parseDeclination('-05:04:03.2'),
        extentArcsec: 120,
        fluxDensityMJy: 3.5,
        line: { restGHz: 1.420405751768, velocityKmS: 1250, convention: 'optical' },
      },
      {
        id: expect.any(String),
        name: 'Decimal source',
        raDeg: 150.1,
        decDeg: 22.5,
        extentArcsec: 0,
        fluxDensityMJy: null,
        line: null,
      },
    ]);
    // 10h00m24s is 150.1° (15° per hour), by hand.
    expect(targets(p)[0]!.raDeg).toBeCloseTo(150.1, 12);
  });

  it('names each bad field with a 400 and saves nothing', async () => {
    const { p, base } = await fresh();
    const cases: [Record<string, unknown>, string[]][] = [
      [{ ra: '25:00:00' }, ['ra']],
      [{ dec: '+95' }, ['dec']],
      [{ ra: 'north' }, ['ra']],
      [{ name: '  ' }, ['name']],
      [{ extentArcsec: -1 }, ['extentArcsec']],
      [{ line: { restGHz: 1.4, velocityKmS: 100 } }, ['line.convention']],
      [{ line: { restGHz: 1.4 } }, ['line.velocityKmS']],
      [
        { line: { restGHz: 1.4, redshift: 0.1, velocityKmS: 5, convention: 'radio' } },
        ['line.redshift'],
      ],
      [{ line: { restGHz: 1.4, velocityKmS: 300000, convention: 'radio' } }, ['line.velocityKmS']],
      [{ line: { restGHz: 1.4, redshift: 0.1, convention: 'radio' } }, ['line.convention']],
    ];
    for (const [over, paths] of cases) {
      const res = await pi.post(`${base}/targets`, {
        version: p.version,
        name: 'Bad',
        ra: '1:00:00',
        dec: '+10:00:00',
        ...over,
      });
      expect({
        over,
        status: res.status,
        paths: res.body.issues?.map((i: { path: string }) => i.path),
      }).toEqual({
        over,
        status: 400,
        paths,
      });
    }
    const ra = await pi.post(`${base}/targets`, {
      version: p.version,
      name: 'Bad',
      ra: '25:00:00',
      dec: '0',
    });
    expect(ra.body.issues[0].message).toBe(
      'Right ascension hours must be below 24, got 25 (in "25:00:00").',
    );
    expect((await pi.get(base)).body).toMatchObject({ version: p.version, targets: [] });
  });

  it('refuses a second target of the same name', async () => {
    const fresh_ = await fresh();
    const base = fresh_.base;
    let p = fresh_.p;
    p = await must(
      pi.post(`${base}/targets`, { version: p.version, name: 'Twin', ra: '1', dec: '2' }),
      201,
    );
    const res = await pi.post(`${base}/targets`, {
      version: p.version,
      name: 'twin',
      ra: '3',
      dec: '4',
    });
    expect({ status: res.status, path: res.body.issues?.[0]?.path }).toEqual({
      status: 400,
      path: 'name',
    });
  });

  it('recomputes the observations of a changed target, and refuses to delete a target in use', async () => {
    const fresh_ = await fresh();
    const base = fresh_.base;
    let p = fresh_.p;
    p = await must(
      pi.post(`${base}/targets`, { version: p.version, name: 'Mover', ra: '10:00:00', dec: '-30' }),
      201,
    );
    const target = targets(p)[0]!;
    p = await must(
      pi.post(`${base}/observations`, { version: p.version, ...observationOf(array, target.id) }),
      201,
    );
    const obs = () =>
      (
        p.observations as {
          id: string;
          checks: { code: string }[];
          result: { maxElevationDeg: number };
        }[]
      )[0]!;
    expect(obs().checks.map((c) => c.code)).not.toContain('NEVER_RISES');

    // At latitude −30.5° with a 15° limit, +80° never rises (highest elevation 90 − |φ − δ|).
    p = await must(pi.patch(`${base}/targets/${target.id}`, { version: p.version, dec: '+80' }));
    expect(targets(p)[0]).toMatchObject({ name: 'Mover', decDeg: 80, raDeg: 150 });
    expect(obs().result.maxElevationDeg).toBeCloseTo(90 - Math.abs(-30.5 - 80), 9);
    expect(obs().checks.map((c) => c.code)).toContain('NEVER_RISES');

    const del = await pi.delete(`${base}/targets/${target.id}?version=${p.version}`);
    expect({ status: del.status, code: del.body.code }).toEqual({
      status: 409,
      code: 'TARGET_IN_USE',
    });
    p = await must(pi.delete(`${base}/observations/${obs().id}?version=${p.version}`));
    p = await must(pi.delete(`${base}/targets/${target.id}?version=${p.version}`));
    expect(targets(p)).toEqual([]);
  });

  describe('CSV import', () => {
    const CSV = [
      'Name,RA,Dec,extent_arcsec,flux_mjy,rest_ghz,velocity_km_s,convention,redshift',
      'Good one,10:00:24.0,-05:04:03.2,30,1.5,,,,',
      '"Comma, in the name",150.1,22.5,,,,,,',
      'Bad dec,12:00:00,+91:00:00,,,,,,',
      '',
      'Line without convention,01:00:00,+10:00:00,,,1.420405751768,1200,,',
      'Redshifted,02:00:00,+20:00:00,0,,115.2712018,,,0.05',
      'good one,03:00:00,+30:00:00,,,,,,',
      'Not a number,04:00:00,+40:00:00,wide,,,,,',
    ].join('\r\n');

    it('previews every row with its errors and saves nothing (dry run)', async () => {
      const { p, base } = await fresh();
      const res = await pi.post(`${base}/targets/import`, {
        version: p.version,
        csv: CSV,
        dryRun: true,
      });
      expect(res.status).toBe(200);
      const { rows, valid, invalid } = res.body;

      // The same text through papaparse on its own (RFC 4180 quoting), and the library's parsers.
      const parsed = Papa.parse<Record<string, string>>(CSV, {
        header: true,
        skipEmptyLines: 'greedy',
        transformHeader: (h) => h.trim().toLowerCase(),
      }).data;
      expect(rows.map((r: { name: string }) => r.name)).toEqual(parsed.map((r) => r.name));
      for (const [i, row] of parsed.entries()) {
        if (rows[i].errors.some((e: { column: string }) => e.column === 'ra' || e.column === 'dec'))
          continue;
        expect(rows[i].raDeg).toBe(parseRightAscension(row.ra!));
        expect(rows[i].decDeg).toBe(parseDeclination(row.dec!));
      }
      expect(rows.map((r: { line: number }) => r.line)).toEqual([2, 3, 4, 6, 7, 8, 9]);
      const errors = rows.map((r: { errors: { column: string }[] }) =>
        r.errors.map((e) => e.column),
      );
      expect(errors).toEqual([[], [], ['dec'], ['convention'], [], ['name'], ['extent_arcsec']]);
      expect(rows[5].errors[0].message).toBe('A target named good one is already in line 2');
      expect(rows[2].errors[0].message).toMatch(/Declination/);
      expect(rows[4]).toMatchObject({ restGHz: 115.2712018, redshift: 0.05, velocityKmS: null });
      expect(rows[0]).toMatchObject({ extentArcsec: 30, fluxDensityMJy: 1.5 });
      expect({ valid, invalid }).toEqual({ valid: 3, invalid: 4 });
      expect((await pi.get(base)).body).toMatchObject({ version: p.version, targets: [] });
    });

    it('saves nothing when a row is bad (400 naming rows.<i>.<column>), and everything when all are good', async () => {
      const fresh_ = await fresh();
      const base = fresh_.base;
      let p = fresh_.p;
      const bad = await pi.post(`${base}/targets/import`, {
        version: p.version,
        csv: CSV,
        dryRun: false,
      });
      expect(bad.status).toBe(400);
      expect(bad.body.issues.map((i: { path: string }) => i.path)).toEqual([
        'rows.2.dec',
        'rows.3.convention',
        'rows.5.name',
        'rows.6.extent_arcsec',
      ]);
      expect(bad.body.message).toBe('4 of 7 rows have errors; nothing was imported');
      expect((await pi.get(base)).body).toMatchObject({ version: p.version, targets: [] });

      p = await must(
        pi.post(`${base}/targets`, { version: p.version, name: 'Already here', ra: '5', dec: '5' }),
        201,
      );
      const good = 'name,ra,dec\nFirst,00:10:00,+01:00:00\nSecond,20.5,-3.25\n';
      p = await must(
        pi.post(`${base}/targets/import`, { version: p.version, csv: good, dryRun: false }),
      );
      expect(targets(p).map((x) => [x.name, x.raDeg, x.decDeg])).toEqual([
        ['Already here', 5, 5],
        ['First', 2.5, 1],
        ['Second', 20.5, -3.25],
      ]);
      const clash = await pi.post(`${base}/targets/import`, {
        version: p.version,
        csv: 'name,ra,dec\nfirst,1,1',
        dryRun: true,
      });
      expect(clash.body.rows[0].errors).toEqual([
        { column: 'name', message: 'A target named first is already in the proposal' },
      ]);
    });

    it('refuses a header it cannot use (400 on csv)', async () => {
      const { p, base } = await fresh();
      for (const [csv, message] of [
        ['name,ra\nA,1', /lacks dec/],
        ['name,ra,dec,colour\nA,1,2,red', /Unknown column "colour"/],
        ['', /empty/],
        ['name,ra,dec\n', /no target/],
        ['name,ra,dec,ra\nA,1,2,3', /appears twice/],
      ] as const) {
        const res = await pi.post(`${base}/targets/import`, {
          version: p.version,
          csv,
          dryRun: true,
        });
        expect({ csv, status: res.status, path: res.body.issues?.[0]?.path }).toEqual({
          csv,
          status: 400,
          path: 'csv',
        });
        expect(res.body.message).toMatch(message);
      }
    });
  });
});
