/**
 * The observing-plan generator: properties over random grants (fast-check), and the elevation at
 * every run's start and end computed independently with astronomy-engine's `Horizon`.
 */
import { Horizon, Observer } from 'astronomy-engine';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  generatePlan,
  lstWindow,
  type PlanInput,
  type PlanObservation,
  type PlannedRun,
} from '../src/index.js';

const SITE = {
  eastLongitudeDeg: -118.9,
  latitudeDeg: 47.3,
  timeZone: 'America/Los_Angeles',
  elevationLimitDeg: 15,
};
const DAY_MS = 86_400_000;

const observationArb = (id: number): fc.Arbitrary<PlanObservation> =>
  fc.record({
    id: fc.constant(`obs-${String(id).padStart(2, '0')}`),
    raDeg: fc.double({ min: 0, max: 359.9, noNaN: true }),
    decDeg: fc.double({ min: -40, max: 85, noNaN: true }),
    hours: fc.double({ min: 0.5, max: 30, noNaN: true }),
    tier: fc.constantFrom('tier1' as const, 'tier2' as const, 'tier3' as const),
    rank: fc.integer({ min: 1, max: 50 }),
  });

const inputArb: fc.Arbitrary<PlanInput> = fc
  .record({
    startDay: fc.integer({ min: 0, max: 700 }),
    days: fc.integer({ min: 2, max: 12 }),
    count: fc.integer({ min: 1, max: 10 }),
    maintenanceStartHour: fc.integer({ min: 0, max: 23 }),
    maintenanceHours: fc.integer({ min: 0, max: 6 }),
    weatherReserve: fc.double({ min: 0, max: 0.3, noNaN: true }),
  })
  .chain(({ startDay, days, count, ...rest }) =>
    fc.tuple(...Array.from({ length: count }, (_, i) => observationArb(i))).map((observations) => {
      const start = new Date(Date.UTC(2031, 0, 1) + startDay * DAY_MS);
      const end = new Date(start.getTime() + (days - 1) * DAY_MS);
      return {
        periodStart: start.toISOString().slice(0, 10),
        periodEnd: end.toISOString().slice(0, 10),
        site: SITE,
        observations,
        ...rest,
      };
    }),
  );

/** Local hour of the day at an instant in the site's zone, read with Intl (not the generator's code). */
const LOCAL = new Intl.DateTimeFormat('en-GB', {
  timeZone: SITE.timeZone,
  hourCycle: 'h23',
  hour: '2-digit',
  minute: '2-digit',
});
const localHour = (ms: number): number => {
  const parts = LOCAL.formatToParts(new Date(ms));
  const get = (t: string) => Number(parts.find((p) => p.type === t)!.value);
  return get('hour') + get('minute') / 60;
};

const inMaintenance = (input: PlanInput, ms: number): boolean => {
  if (input.maintenanceHours === 0) return false;
  const h = localHour(ms);
  const from = input.maintenanceStartHour;
  const to = from + input.maintenanceHours;
  return to <= 24 ? h >= from && h < to : h >= from || h < to - 24;
};

/** Whether LST `h` lies on the arc from rise to set (both in [0, 24)), with a small tolerance. */
const onArc = (h: number, rise: number, set: number, eps = 1e-6): boolean => {
  const span = (((set - rise) % 24) + 24) % 24;
  const at = (((h - rise) % 24) + 24) % 24;
  return at <= span + eps || at >= 24 - eps;
};

const ms = (iso: string) => new Date(iso).getTime();

describe('generatePlan', () => {
  it('keeps every run inside the period, apart from the others, out of maintenance and in its LST window', () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const { runs } = generatePlan(input);
        const periodStart = ms(`${input.periodStart}T00:00:00Z`);
        const periodEnd = ms(`${input.periodEnd}T00:00:00Z`) + DAY_MS;
        const sorted = [...runs].sort((a, b) => ms(a.start) - ms(b.start));
        sorted.forEach((run, i) => {
          expect(ms(run.start)).toBeGreaterThanOrEqual(periodStart);
          expect(ms(run.end)).toBeLessThanOrEqual(periodEnd);
          expect(ms(run.end)).toBeGreaterThan(ms(run.start));
          if (i > 0) expect(ms(run.start)).toBeGreaterThanOrEqual(ms(sorted[i - 1]!.end));
          // Maintenance: sample the run every 5 minutes and its last minute (the site's zone
          // changes offset by whole hours, so the window's edges fall on the hour).
          for (let t = ms(run.start); t < ms(run.end); t += 300_000)
            expect(inMaintenance(input, t)).toBe(false);
          expect(inMaintenance(input, ms(run.end) - 60_000)).toBe(false);
          const obs = input.observations.find((o) => o.id === run.observationId)!;
          const window = lstWindow({ ...SITE, ...obs });
          expect(window.visibility).not.toBe('never-rises');
          if (window.visibility === 'rises-and-sets') {
            expect(onArc(run.lstStartHours, window.lstRiseHours!, window.lstSetHours!)).toBe(true);
            expect(onArc(run.lstEndHours, window.lstRiseHours!, window.lstSetHours!)).toBe(true);
            expect(run.hours).toBeLessThanOrEqual(window.hoursAboveLimit + 1e-9);
          }
        });
        // Never more planned than asked.
        for (const obs of input.observations) {
          const planned = runs
            .filter((r) => r.observationId === obs.id)
            .reduce((s, r) => s + r.hours, 0);
          expect(planned).toBeLessThanOrEqual(obs.hours + 1e-9);
        }
      }),
      { numRuns: 40 },
    );
  }, 60_000);

  it('is deterministic and keeps clear of kept runs', () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const first = generatePlan(input);
        expect(generatePlan(input)).toEqual(first);
        // Keep the first run as a locked one: nothing new may overlap it.
        const kept = first.runs[0];
        if (!kept) return;
        const again = generatePlan({
          ...input,
          keptRuns: [{ observationId: kept.observationId, start: kept.start, end: kept.end }],
        });
        for (const run of again.runs)
          expect(ms(run.end) <= ms(kept.start) || ms(run.start) >= ms(kept.end)).toBe(true);
      }),
      { numRuns: 25 },
    );
  }, 60_000);

  it('places tier 1 before tier 2 when both want the same LST', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 359, noNaN: true }), (raDeg) => {
        const input: PlanInput = {
          periodStart: '2031-03-02',
          periodEnd: '2031-03-04',
          site: SITE,
          // Same sky position, each asking for more than the three days can hold.
          observations: [
            { id: 'b-second', raDeg, decDeg: 30, hours: 40, tier: 'tier2', rank: 1 },
            { id: 'a-first', raDeg, decDeg: 30, hours: 40, tier: 'tier1', rank: 9 },
          ],
          maintenanceStartHour: 8,
          maintenanceHours: 0,
          weatherReserve: 0,
        };
        const { runs } = generatePlan(input);
        const hours = (id: string) =>
          runs.filter((r) => r.observationId === id).reduce((s, r) => s + r.hours, 0);
        expect(hours('a-first')).toBeGreaterThan(0);
        expect(hours('a-first')).toBeGreaterThanOrEqual(hours('b-second'));
      }),
      { numRuns: 15 },
    );
  });

  it('starts and ends every run at or above the elevation limit, by astronomy-engine (within 0.1°)', () => {
    // astronomy-engine's Horizon takes of-date equatorial coordinates; the generator's RA/Dec are
    // used as such (no precession), and refraction is left out, as the limit is geometric.
    const observer = new Observer(SITE.latitudeDeg, SITE.eastLongitudeDeg, 0);
    fc.assert(
      fc.property(inputArb, (input) => {
        const { runs } = generatePlan(input);
        const check = (run: PlannedRun, at: string) => {
          const obs = input.observations.find((o) => o.id === run.observationId)!;
          const { altitude } = Horizon(new Date(at), observer, obs.raDeg / 15, obs.decDeg);
          expect(altitude).toBeGreaterThanOrEqual(SITE.elevationLimitDeg - 0.1);
        };
        for (const run of runs) {
          check(run, run.start);
          check(run, run.end);
        }
      }),
      { numRuns: 25 },
    );
  }, 60_000);

  it('lists what does not fit with a reason: a target that never rises', () => {
    const { runs, unplaced } = generatePlan({
      periodStart: '2031-05-01',
      periodEnd: '2031-05-03',
      site: SITE,
      // Dec −80° never rises above 15° at latitude 47.3° N (culminates at 90 − |47.3 + 80| < 0).
      observations: [{ id: 'south', raDeg: 100, decDeg: -80, hours: 2, tier: 'tier1', rank: 1 }],
      maintenanceStartHour: 8,
      maintenanceHours: 2,
      weatherReserve: 0,
    });
    expect(runs).toEqual([]);
    expect(unplaced).toEqual([{ observationId: 'south', hoursUnplaced: 2, reason: 'never_rises' }]);
  });

  // Zones far from UTC and with odd offsets (UTC+14, UTC−11, UTC+5:45, UTC−3:30 with DST): the
  // local maintenance hours are read back with Intl per 5-minute slot, independent of the
  // generator's own offset arithmetic (zone offsets from the IANA database, through Intl).
  it.each(['Pacific/Kiritimati', 'Pacific/Pago_Pago', 'Asia/Kathmandu', 'America/St_Johns'])(
    'keeps the maintenance window in local time for %s, across a DST change where there is one',
    (timeZone) => {
      const input: PlanInput = {
        periodStart: '2031-03-05',
        periodEnd: '2031-03-14',
        site: { ...SITE, timeZone },
        observations: Array.from({ length: 6 }, (_, i) => ({
          id: `z${i}`,
          raDeg: i * 60,
          decDeg: 20,
          hours: 20,
          tier: 'tier1' as const,
          rank: i + 1,
        })),
        maintenanceStartHour: 22,
        maintenanceHours: 5,
        weatherReserve: 0,
      };
      const fmt = new Intl.DateTimeFormat('en-GB', {
        timeZone,
        hourCycle: 'h23',
        hour: '2-digit',
        minute: '2-digit',
      });
      const hourAt = (t: number) => {
        const parts = fmt.formatToParts(new Date(t));
        const get = (k: string) => Number(parts.find((p) => p.type === k)!.value);
        return get('hour') + get('minute') / 60;
      };
      const { runs } = generatePlan(input);
      expect(runs.length).toBeGreaterThan(0);
      for (const run of runs)
        for (let t = ms(run.start); t < ms(run.end); t += 300_000) {
          const h = hourAt(t);
          expect({
            run: run.start,
            at: new Date(t).toISOString(),
            inWindow: h >= 22 || h < 3,
          }).toEqual({ run: run.start, at: new Date(t).toISOString(), inWindow: false });
        }
    },
  );

  it('plans a never-setting target in runs of at most a day, one per UTC day, to its hours', () => {
    const { runs, unplaced } = generatePlan({
      periodStart: '2031-05-01',
      periodEnd: '2031-05-04',
      site: SITE,
      // δ = +80° at φ = +47.3° stays above 15° all day: its lowest elevation, at lower
      // culmination, is φ + δ − 90° = 37.3° (the textbook circumpolar condition).
      observations: [{ id: 'polar', raDeg: 30, decDeg: 80, hours: 30, tier: 'tier1', rank: 1 }],
      maintenanceStartHour: 8,
      maintenanceHours: 0,
      weatherReserve: 0,
    });
    expect(unplaced).toEqual([]);
    expect(runs.reduce((s, r) => s + r.hours, 0)).toBeCloseTo(30, 9);
    for (const r of runs) expect(r.hours).toBeLessThanOrEqual(24);
    const days = runs.map((r) => r.start.slice(0, 10));
    expect(new Set(days).size).toBe(days.length);
  });
});
