import type { Tone } from '@/components/ui/status-indicator';
import type { ReviewStatus } from './api';

export const STATUS_LABELS: Record<ReviewStatus, string> = {
  invited: 'Not started',
  accepted: 'Draft saved',
  submitted: 'Submitted',
  declined: 'Declined',
  conflicted: 'In conflict',
};

export const STATUS_TONES: Record<ReviewStatus, Tone> = {
  invited: 'warning',
  accepted: 'note',
  submitted: 'success',
  declined: 'blocker',
  conflicted: 'blocker',
};

export const EXPERTISE_LABELS: Record<1 | 2 | 3, string> = {
  1: '1 — general knowledge of the field',
  2: '2 — work in a related field',
  3: '3 — expert in the subject',
};
