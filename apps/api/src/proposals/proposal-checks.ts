import type { Check, CheckLevel } from '@skyhours/calc';
import { isAcceptingSubmissions } from '../calls/calls.service.js';
import type { Call } from '../calls/entities/call.entity.js';
import { BYTES_PER_MB } from '../documents/science-case.service.js';
import { KIND_LABELS, ABSTRACT_WORD_LIMIT, countWords } from './proposal-options.js';
import type { ProposalObservation } from './entities/proposal-observation.entity.js';
import { type ProposalData, totalHoursAsked } from './proposal-data.js';

/** A check of the calculator's shape whose code may also be one of the server's own. */
export type ObservationCheck = Omit<Check, 'code'> & { code: string };

export type CheckSection = 'overview' | 'team' | 'observations' | 'documents';

/** One finding of the whole proposal, with the editor section it belongs to. */
export interface ProposalCheck {
  level: CheckLevel;
  code: string;
  field: string;
  message: string;
  section: CheckSection;
  observationId?: string;
  targetId?: string;
}

export interface CheckSummary {
  blockers: number;
  warnings: number;
  notes: number;
  items: ProposalCheck[];
}

const LEVEL_ORDER: Record<CheckLevel, number> = { blocker: 0, warning: 1, note: 2 };

/** Hours as people write them: at most two decimals. */
export const hoursText = (h: number): string => String(Math.round(h * 100) / 100);

/** An instant as `2027-01-15 17:00 UTC` (seconds only when there are some). */
export function utcText(at: Date): string {
  const iso = at.toISOString();
  const seconds = iso.slice(17, 19);
  return `${iso.slice(0, 10)} ${iso.slice(11, seconds === '00' ? 16 : 19)} UTC`;
}

export const deadlinePassedMessage = (call: Pick<Call, 'code' | 'deadlineAt'>): string =>
  `The deadline of ${call.code} passed at ${utcText(call.deadlineAt)}; submissions are closed`;

/**
 * Checks that depend on the call as it is now (its capacities can change after the observation
 * was saved), added to the calculator's stored checks of one observation.
 */
export function observationCallChecks(call: Call, o: ProposalObservation): ObservationCheck[] {
  const checks: ObservationCheck[] = [];
  const offered = call.capacities ?? [];
  if (!offered.some((c) => c.configurationId === o.configurationId)) {
    const names = offered
      .map((c) => c.configuration?.name)
      .filter((n): n is string => Boolean(n))
      .sort();
    checks.push({
      level: 'blocker',
      code: 'CONFIGURATION_NOT_OFFERED',
      field: 'configurationId',
      message: `Call ${call.code} offers no hours in the ${o.configuration?.name ?? 'chosen'} configuration; it offers ${names.length ? names.join(', ') : 'none'}.`,
    });
  }
  const recorded = o.band?.polarizations ?? [1, 2];
  if (!recorded.map(Number).includes(o.polarizations)) {
    checks.push({
      level: 'blocker',
      code: 'POLARIZATIONS_NOT_OFFERED',
      field: 'polarizations',
      message: `${o.band?.name ?? 'The band'} records ${recorded.join(' or ')} polarisation${recorded.length === 1 && recorded[0] === 1 ? '' : 's'}, not ${o.polarizations}.`,
    });
  }
  return checks;
}

/** An observation's checks as the API shows them: the calculator's, then the call's. */
export const observationChecks = (call: Call, o: ProposalObservation): ObservationCheck[] =>
  [...o.checks, ...observationCallChecks(call, o)].sort(
    (a, b) => LEVEL_ORDER[a.level] - LEVEL_ORDER[b.level],
  );

/**
 * Every finding about the proposal at `now`: each observation's checks and the proposal-level
 * rules. Blockers stop a submission; warnings and notes do not.
 */
export function proposalChecks(data: ProposalData, now: Date): CheckSummary {
  const { proposal, observations, targets, members, scienceCase } = data;
  const call = proposal.call;
  const items: ProposalCheck[] = [];
  const add = (item: ProposalCheck) => items.push(item);

  // Overview
  if (proposal.title.trim() === '')
    add({
      level: 'blocker',
      code: 'TITLE_MISSING',
      field: 'title',
      section: 'overview',
      message: 'The proposal has no title.',
    });
  const words = countWords(proposal.abstract);
  if (words === 0)
    add({
      level: 'blocker',
      code: 'ABSTRACT_MISSING',
      field: 'abstract',
      section: 'overview',
      message: 'The proposal has no abstract.',
    });
  else if (words > ABSTRACT_WORD_LIMIT)
    add({
      level: 'blocker',
      code: 'ABSTRACT_TOO_LONG',
      field: 'abstract',
      section: 'overview',
      message: `The abstract has ${words} words; the limit is ${ABSTRACT_WORD_LIMIT}.`,
    });
  if (!proposal.scienceCategory)
    add({
      level: 'blocker',
      code: 'SCIENCE_CATEGORY_MISSING',
      field: 'scienceCategory',
      section: 'overview',
      message: 'Choose a science category.',
    });
  if (!call.proposalKinds.includes(proposal.kind))
    add({
      level: 'blocker',
      code: 'KIND_NOT_ACCEPTED',
      field: 'kind',
      section: 'overview',
      message: `Call ${call.code} does not accept ${KIND_LABELS[proposal.kind].toLowerCase()} proposals; it accepts ${call.proposalKinds.map((k) => KIND_LABELS[k].toLowerCase()).join(', ')}.`,
    });
  if (proposal.status === 'draft' && !isAcceptingSubmissions(call, now)) {
    const passed = now.getTime() >= call.deadlineAt.getTime();
    add({
      level: 'blocker',
      code: passed ? 'DEADLINE_PASSED' : 'CALL_NOT_OPEN',
      field: 'call',
      section: 'overview',
      message: passed
        ? deadlinePassedMessage(call)
        : `Call ${call.code} does not take submissions now.`,
    });
  }

  // Team
  for (const m of members.filter((x) => !x.joined))
    add({
      level: 'warning',
      code: 'INVITATION_PENDING',
      field: 'team',
      section: 'team',
      message: `${m.email} has not joined yet: until they do, they are not on the submitted proposal and get no e-mail about it.`,
    });

  // Observations
  if (observations.length === 0)
    add({
      level: 'blocker',
      code: 'NO_OBSERVATIONS',
      field: 'observations',
      section: 'observations',
      message: 'The proposal asks for no observation.',
    });
  const total = totalHoursAsked(observations);
  if (total > call.maxHoursPerProposal)
    add({
      level: 'blocker',
      code: 'HOURS_ABOVE_CALL_LIMIT',
      field: 'hoursAsked',
      section: 'observations',
      message: `The proposal asks for ${hoursText(total)} h in all; call ${call.code} allows at most ${hoursText(call.maxHoursPerProposal)} h per proposal.`,
    });
  observations.forEach((o, i) => {
    for (const check of observationChecks(call, o))
      add({
        level: check.level,
        code: check.code,
        field: check.field,
        section: 'observations',
        message: `Observation ${i + 1}: ${check.message}`,
        observationId: o.id,
        targetId: o.targetId,
      });
  });
  const used = new Set(observations.map((o) => o.targetId));
  for (const t of targets.filter((x) => !used.has(x.id)))
    add({
      level: 'note',
      code: 'TARGET_UNUSED',
      field: 'targets',
      section: 'observations',
      message: `Target ${t.name} has no observation.`,
      targetId: t.id,
    });

  // Documents
  if (!scienceCase)
    add({
      level: 'blocker',
      code: 'SCIENCE_CASE_MISSING',
      field: 'documents.scienceCase',
      section: 'documents',
      message: 'Upload the science case (a PDF).',
    });
  else {
    if (scienceCase.pages > call.scienceCasePageLimit)
      add({
        level: 'blocker',
        code: 'SCIENCE_CASE_OVER_LIMIT',
        field: 'documents.scienceCase',
        section: 'documents',
        message: `The science case has ${scienceCase.pages} pages; call ${call.code} now allows at most ${call.scienceCasePageLimit}.`,
      });
    if (scienceCase.sizeBytes > call.scienceCaseMaxMb * BYTES_PER_MB)
      add({
        level: 'blocker',
        code: 'SCIENCE_CASE_OVER_LIMIT',
        field: 'documents.scienceCase',
        section: 'documents',
        message: `The science case is ${(scienceCase.sizeBytes / BYTES_PER_MB).toFixed(1)} MB; call ${call.code} now allows at most ${call.scienceCaseMaxMb} MB.`,
      });
    // Findings were made for an anonymous call; they no longer apply once it is not.
    if (call.anonymousReview)
      for (const f of proposal.scienceCaseFindings) add({ ...f, section: 'documents' });
  }

  items.sort((a, b) => LEVEL_ORDER[a.level] - LEVEL_ORDER[b.level]);
  const count = (level: CheckLevel) => items.filter((c) => c.level === level).length;
  return { blockers: count('blocker'), warnings: count('warning'), notes: count('note'), items };
}
