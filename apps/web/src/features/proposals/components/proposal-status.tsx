import { HStack, Text } from '@chakra-ui/react';
import { StatusIndicator } from '@/components/ui/status-indicator';
import type { ProposalStatus } from '../api';
import { STATUS_LABELS, STATUS_TONES, plural } from '../labels';

/** A proposal's status: icon and words. */
export function ProposalStatusIndicator({ status }: { status: ProposalStatus }) {
  return (
    <StatusIndicator tone={STATUS_TONES[status]} data-status={status}>
      {STATUS_LABELS[status]}
    </StatusIndicator>
  );
}

/** "2 blockers · 1 warning", each with its icon, or a quiet "None" when there are neither. */
export function CheckCounts({ blockers, warnings }: { blockers: number; warnings: number }) {
  if (blockers === 0 && warnings === 0) {
    return (
      <Text as="span" color="fg.muted">
        None
      </Text>
    );
  }
  return (
    <HStack gap="3" wrap="wrap">
      {blockers > 0 && (
        <StatusIndicator tone="blocker">{plural(blockers, 'blocker')}</StatusIndicator>
      )}
      {warnings > 0 && (
        <StatusIndicator tone="warning">{plural(warnings, 'warning')}</StatusIndicator>
      )}
    </HStack>
  );
}
