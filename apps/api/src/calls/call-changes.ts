import { DateTime } from 'luxon';
import { CALL_STATUSES, type CallStatus } from './call-lifecycle.js';
import type { Call } from './entities/call.entity.js';

/** The fields of a call staff can change after creating it, in the order they are reported. */
export const EDITABLE_FIELDS = [
  'title',
  'description',
  'timeZone',
  'opensAt',
  'deadlineAt',
  'reviewDueAt',
  'capacity',
  'scienceCasePageLimit',
  'scienceCaseMaxMb',
  'proposalKinds',
  'maxHoursPerProposal',
  'scoreMin',
  'scoreMax',
  'scoreHigherIsBetter',
  'refereesPerProposal',
  'anonymousReview',
] as const;
export type EditableField = (typeof EDITABLE_FIELDS)[number];

/** A call's editable values in one comparable shape (instants as Dates, capacity by id). */
export interface CallValues {
  title: string;
  description: string;
  timeZone: string;
  opensAt: Date;
  deadlineAt: Date;
  reviewDueAt: Date;
  capacity: { configurationId: string; hours: number }[];
  scienceCasePageLimit: number;
  scienceCaseMaxMb: number;
  proposalKinds: string[];
  maxHoursPerProposal: number;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  refereesPerProposal: number;
  anonymousReview: boolean;
}

export function valuesOf(call: Call): CallValues {
  return {
    title: call.title,
    description: call.description,
    timeZone: call.timeZone,
    opensAt: call.opensAt,
    deadlineAt: call.deadlineAt,
    reviewDueAt: call.reviewDueAt,
    capacity: (call.capacities ?? []).map((c) => ({
      configurationId: c.configurationId,
      hours: c.hoursOffered,
    })),
    scienceCasePageLimit: call.scienceCasePageLimit,
    scienceCaseMaxMb: call.scienceCaseMaxMb,
    proposalKinds: call.proposalKinds,
    maxHoursPerProposal: call.maxHoursPerProposal,
    scoreMin: call.scoreMin,
    scoreMax: call.scoreMax,
    scoreHigherIsBetter: call.scoreHigherIsBetter,
    refereesPerProposal: call.refereesPerProposal,
    anonymousReview: call.anonymousReview,
  };
}

/** A JSON form in which equal values compare equal (order of sets ignored). */
function comparable(field: EditableField, value: CallValues[EditableField]): string {
  if (value instanceof Date) return value.toISOString();
  if (field === 'capacity')
    return JSON.stringify(
      [...(value as CallValues['capacity'])].sort((a, b) =>
        a.configurationId.localeCompare(b.configurationId),
      ),
    );
  if (field === 'proposalKinds') return JSON.stringify([...(value as string[])].sort());
  return JSON.stringify(value);
}

/** The fields whose value differs between two versions of a call. */
export function changedFields(before: CallValues, after: CallValues): EditableField[] {
  return EDITABLE_FIELDS.filter((f) => comparable(f, before[f]) !== comparable(f, after[f]));
}

/**
 * The last status in which each field may still change. Rules proposers rely on (deadline, limits)
 * freeze when the call closes; the review settings when review starts; capacity stays open to
 * corrections until the outcome is published. An archived call changes no more.
 */
const EDITABLE_UNTIL: Record<EditableField, CallStatus> = {
  title: 'published',
  description: 'published',
  timeZone: 'published',
  opensAt: 'open',
  deadlineAt: 'open',
  reviewDueAt: 'in_review',
  capacity: 'deliberation',
  scienceCasePageLimit: 'open',
  scienceCaseMaxMb: 'open',
  proposalKinds: 'open',
  maxHoursPerProposal: 'open',
  scoreMin: 'closed',
  scoreMax: 'closed',
  scoreHigherIsBetter: 'closed',
  refereesPerProposal: 'closed',
  anonymousReview: 'closed',
};

export function lockedFields(fields: EditableField[], status: CallStatus): EditableField[] {
  return fields.filter(
    (f) => CALL_STATUSES.indexOf(status) > CALL_STATUSES.indexOf(EDITABLE_UNTIL[f]),
  );
}

const FIELD_LABELS: Record<EditableField, string> = {
  title: 'Title',
  description: 'Description',
  timeZone: 'Time zone of the call',
  opensAt: 'Opening',
  deadlineAt: 'Deadline',
  reviewDueAt: 'Review due',
  capacity: 'Hours on offer',
  scienceCasePageLimit: 'Page limit of the science case',
  scienceCaseMaxMb: 'Size limit of the science case',
  proposalKinds: 'Proposal kinds accepted',
  maxHoursPerProposal: 'Largest request per proposal',
  scoreMin: 'Lowest score',
  scoreMax: 'Highest score',
  scoreHigherIsBetter: 'Score direction',
  refereesPerProposal: 'Referees per proposal',
  anonymousReview: 'Anonymous review',
};

/** "Fri 15 Jan 2027, 17:00 PST (01:00 UTC, Sat 16 Jan 2027)": the call's zone, then UTC. */
export function formatInstant(instant: Date, zone: string): string {
  const local = DateTime.fromJSDate(instant, { zone });
  const utc = DateTime.fromJSDate(instant, { zone: 'utc' });
  const sameDay = local.toISODate() === utc.toISODate();
  return `${local.toFormat('ccc d LLL yyyy, HH:mm ZZZZ')} (${utc.toFormat('HH:mm')} UTC${sameDay ? '' : utc.toFormat(', ccc d LLL yyyy')})`;
}

const KIND_LABELS: Record<string, string> = {
  standard: 'standard',
  large: 'large',
  target_of_opportunity: 'target of opportunity',
  discretionary: 'discretionary',
};

function describe(
  field: EditableField,
  values: CallValues,
  configurationNames: Map<string, string>,
): string {
  switch (field) {
    case 'opensAt':
    case 'deadlineAt':
    case 'reviewDueAt':
      return formatInstant(values[field], values.timeZone);
    case 'capacity':
      return values.capacity.length === 0
        ? 'none'
        : values.capacity
            .map((c) => `${configurationNames.get(c.configurationId) ?? 'unknown'} ${c.hours} h`)
            .join(', ');
    case 'scienceCasePageLimit':
      return `${values.scienceCasePageLimit} pages`;
    case 'scienceCaseMaxMb':
      return `${values.scienceCaseMaxMb} MB`;
    case 'maxHoursPerProposal':
      return `${values.maxHoursPerProposal} h`;
    case 'proposalKinds':
      return values.proposalKinds.map((k) => KIND_LABELS[k] ?? k).join(', ');
    case 'scoreHigherIsBetter':
      return values.scoreHigherIsBetter ? 'higher is better' : 'lower is better';
    case 'anonymousReview':
      return values.anonymousReview ? 'on' : 'off';
    default:
      return String(values[field]);
  }
}

/** One sentence per changed field, for the e-mail to PIs ("Deadline: was …; now …."). */
export function describeChanges(
  fields: EditableField[],
  before: CallValues,
  after: CallValues,
  configurationNames: Map<string, string>,
): string[] {
  return fields.map((f) =>
    f === 'description'
      ? 'Description: the text of the call was revised.'
      : `${FIELD_LABELS[f]}: was ${describe(f, before, configurationNames)}; now ${describe(f, after, configurationNames)}.`,
  );
}

/** The audit log's form of the changes: { field: { from, to } } with instants in ISO. */
export function auditChanges(
  fields: EditableField[],
  before: CallValues,
  after: CallValues,
): Record<string, { from: unknown; to: unknown }> {
  const plain = (v: unknown) => (v instanceof Date ? v.toISOString() : v);
  return Object.fromEntries(
    fields.map((f) => [f, { from: plain(before[f]), to: plain(after[f]) }]),
  );
}
