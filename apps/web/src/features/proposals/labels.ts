import type { Tone } from '@/components/ui/status-indicator';
import type { CheckLevel, EditorSection, ProposalKind, ProposalStatus, TeamRole } from './api';

export const STATUS_LABELS: Record<ProposalStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  withdrawn: 'Withdrawn',
  under_review: 'Under review',
  allocated: 'Time allocated',
  not_allocated: 'Not allocated',
  in_progress: 'Being observed',
  completed: 'Completed',
};

/** Each status's tone; the words always go with it. */
export const STATUS_TONES: Record<ProposalStatus, Tone> = {
  draft: 'note',
  submitted: 'success',
  withdrawn: 'warning',
  under_review: 'note',
  allocated: 'success',
  not_allocated: 'warning',
  in_progress: 'note',
  completed: 'success',
};

export const KIND_LABELS: Record<ProposalKind, string> = {
  standard: 'Standard',
  large: 'Large',
  target_of_opportunity: 'Target of opportunity',
  discretionary: "Director's discretionary time",
};

export const kindLabel = (kind: string) => KIND_LABELS[kind as ProposalKind] ?? kind;

export const ROLE_LABELS: Record<TeamRole, string> = { pi: 'PI', coi: 'Co-I' };

export const LEVEL_LABELS: Record<CheckLevel, string> = {
  blocker: 'Blocker',
  warning: 'Warning',
  note: 'Note',
};

export const LEVEL_PLURALS: Record<CheckLevel, string> = {
  blocker: 'Blockers',
  warning: 'Warnings',
  note: 'Notes',
};

export const plural = (count: number, one: string, many = `${one}s`) =>
  `${count} ${count === 1 ? one : many}`;

/** The editor's sections, in order; the first four are where the proposal's fields live. */
export const SECTIONS = [
  { id: 'overview', label: 'Overview' },
  { id: 'team', label: 'Team' },
  { id: 'observations', label: 'Observations' },
  { id: 'documents', label: 'Documents' },
  { id: 'checks', label: 'Checks' },
  { id: 'submit', label: 'Submit' },
] as const;

export type SectionId = (typeof SECTIONS)[number]['id'];

export const isSection = (value: string | undefined): value is SectionId =>
  SECTIONS.some((section) => section.id === value);

export const sectionLabel = (id: EditorSection | SectionId) =>
  SECTIONS.find((section) => section.id === id)?.label ?? id;
