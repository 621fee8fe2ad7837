import { StatusIndicator } from '@/components/ui/status-indicator';
import type { ReviewStatus } from '../api';
import { STATUS_LABELS, STATUS_TONES } from '../labels';

export function ReviewStatusIndicator({ status }: { status: ReviewStatus }) {
  return <StatusIndicator tone={STATUS_TONES[status]}>{STATUS_LABELS[status]}</StatusIndicator>;
}
