import { Stack, Text } from '@chakra-ui/react';
import { formatCountdown, formatLocalAndUtc } from '@/lib/time';

/** A review due date: the countdown (while ahead), the viewer's zone and UTC, each named. */
export function DueDate({ at, now }: { at: string; now: Date }) {
  const { local, utc } = formatLocalAndUtc(at);
  const ahead = new Date(at).getTime() > now.getTime();
  return (
    <Stack gap="0">
      <Text asChild>
        <time dateTime={at} title={`${local} · ${utc}`}>
          {ahead ? formatCountdown(at, now) : `Was due ${local}`}
        </time>
      </Text>
      <Text fontSize="xs" color="fg.muted">
        {ahead ? `${local} · ${utc}` : utc}
      </Text>
    </Stack>
  );
}
