import { Badge } from '@chakra-ui/react';
import type { Call } from '../api';
import { STATUS_LABELS } from '../labels';

/** The call's status in words; an open call not yet taking submissions says when it opens. */
export function CallStatusBadge({ call }: { call: Pick<Call, 'status' | 'acceptingSubmissions'> }) {
  const upcoming = call.status === 'open' && !call.acceptingSubmissions;
  return (
    <Badge
      size="md"
      variant={call.status === 'open' ? 'solid' : 'outline'}
      colorPalette={call.status === 'open' ? 'brand' : 'gray'}
    >
      {upcoming ? 'Opening soon' : STATUS_LABELS[call.status]}
    </Badge>
  );
}
