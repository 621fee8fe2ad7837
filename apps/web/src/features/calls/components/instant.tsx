import { Stack, Text } from '@chakra-ui/react';
import { formatInstant, formatLocalAndUtc, formatCountdown } from '@/lib/time';

export interface InstantProps {
  at: string;
  /** Also say the time in this zone (the call's), besides the viewer's and UTC. */
  callZone?: string;
  /** Tick for the countdown; no countdown without it. */
  now?: Date;
}

/**
 * A moment that must not be misread: in the viewer's zone and in UTC (each zone named), and
 * optionally in the call's zone and as a countdown.
 */
export function Instant({ at, callZone, now }: InstantProps) {
  const { local, utc } = formatLocalAndUtc(at);
  const site = callZone ? formatInstant(at, { timeZone: callZone }) : null;
  return (
    <Stack gap="0.5">
      <Text asChild fontWeight="medium">
        <time dateTime={at}>{local}</time>
      </Text>
      <Text fontSize="sm" color="fg.muted">
        {utc}
      </Text>
      {site && site !== local && (
        <Text fontSize="sm" color="fg.muted">
          In the call&apos;s zone: {site}
        </Text>
      )}
      {now && (
        <Text fontSize="sm" color="fg.muted" aria-live="off">
          {formatCountdown(at, now)}
        </Text>
      )}
    </Stack>
  );
}
