import { stringify } from 'csv-stringify/sync';
import ical, { ICalCalendarMethod } from 'ical-generator';
import { DateTime } from 'luxon';
import { defuseCell } from '../allocation/standing-csv.js';
import type { PlanRun } from './plan-contract.js';

const TIER_LABELS = { tier1: 'Tier 1', tier2: 'Tier 2', tier3: 'Tier 3' } as const;
const hhmm = (lstHours: number) => {
  const minutes = Math.round(lstHours * 60) % 1440;
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
};
const siteTime = (iso: string, zone: string) =>
  DateTime.fromISO(iso, { zone: 'utc' }).setZone(zone).toFormat('yyyy-LL-dd HH:mm ZZZZ');

/**
 * The runs as iCalendar (RFC 5545): one VEVENT per run, its times in UTC (…Z), so no VTIMEZONE
 * is needed; the site's zone is named in X-WR-TIMEZONE and each event's description gives the
 * site's local times and the LST.
 */
export function runsCalendar(args: {
  name: string;
  runs: PlanRun[];
  zoneOf: (run: PlanRun) => string;
  host: string;
}): string {
  const zones = [...new Set(args.runs.map(args.zoneOf))];
  const cal = ical({ name: args.name, prodId: { company: 'Skyhours', product: 'plan' } });
  cal.method(ICalCalendarMethod.PUBLISH);
  if (zones.length === 1) cal.x([{ key: 'X-WR-TIMEZONE', value: zones[0]! }]);
  for (const run of args.runs) {
    const zone = args.zoneOf(run);
    cal.createEvent({
      id: `${run.id}@${args.host}`,
      start: new Date(run.startsAt),
      end: new Date(run.endsAt),
      summary: `${run.proposal.reference} ${run.target.name}`,
      description: [
        `${run.proposal.reference} “${run.proposal.title}”, observation ${run.observation.position} (${run.observation.configurationName})`,
        `Status: ${run.status}${run.locked ? ', locked' : ''}`,
        `Site time (${zone}): ${siteTime(run.startsAt, zone)} to ${siteTime(run.endsAt, zone)}`,
        `LST ${hhmm(run.lstStartHours)} to ${hhmm(run.lstEndHours)}`,
      ].join('\n'),
    });
  }
  return cal.toString();
}

/** The runs as CSV (RFC 4180 through csv-stringify); typed text cells cannot become formulas. */
export function runsCsv(runs: PlanRun[], zone: string): string {
  return stringify(
    runs.map((r) => ({
      id: r.id,
      reference: r.proposal.reference,
      title: defuseCell(r.proposal.title),
      tier: r.tier ? TIER_LABELS[r.tier] : '',
      observation: r.observation.position,
      configuration: defuseCell(r.observation.configurationName),
      target: defuseCell(r.target.name),
      startsAtUtc: r.startsAt,
      endsAtUtc: r.endsAt,
      startsAtSite: siteTime(r.startsAt, zone),
      endsAtSite: siteTime(r.endsAt, zone),
      lstStart: hhmm(r.lstStartHours),
      lstEnd: hhmm(r.lstEndHours),
      hours: Math.round(r.hours * 1000) / 1000,
      status: r.status,
      locked: r.locked ? 'yes' : 'no',
      hoursObtained: r.hoursObtained ?? '',
      qualityNote: defuseCell(r.qualityNote),
      lostReason: r.lostReason ?? '',
    })),
    {
      header: true,
      record_delimiter: '\r\n',
      columns: [
        { key: 'id', header: 'run id' },
        { key: 'reference', header: 'reference' },
        { key: 'title', header: 'title' },
        { key: 'tier', header: 'tier' },
        { key: 'observation', header: 'observation' },
        { key: 'configuration', header: 'configuration' },
        { key: 'target', header: 'target' },
        { key: 'startsAtUtc', header: 'start UTC' },
        { key: 'endsAtUtc', header: 'end UTC' },
        { key: 'startsAtSite', header: `start ${zone}` },
        { key: 'endsAtSite', header: `end ${zone}` },
        { key: 'lstStart', header: 'LST start' },
        { key: 'lstEnd', header: 'LST end' },
        { key: 'hours', header: 'hours' },
        { key: 'status', header: 'status' },
        { key: 'locked', header: 'locked' },
        { key: 'hoursObtained', header: 'hours obtained' },
        { key: 'qualityNote', header: 'quality note' },
        { key: 'lostReason', header: 'lost reason' },
      ],
    },
  );
}
