import { Box, Grid, HStack, Stack, Text } from '@chakra-ui/react';
import { Lock } from 'lucide-react';
import type { PlanRun } from '../api';
import { lstText, RUN_STATUS_LABELS, zonedDay, zonedText } from '../labels';

const DAY_MINUTES = 1440;

/** Minutes since local midnight of an instant in a zone. */
function localMinutes(iso: string, timeZone: string): number {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(new Date(iso));
  const get = (t: string) => Number(parts.find((p) => p.type === t)?.value ?? 0);
  return get('hour') * 60 + get('minute');
}

const STATUS_STYLE = {
  planned: { bg: 'note.subtle', borderColor: 'note.solid', borderStyle: 'dashed' },
  observed: { bg: 'success.subtle', borderColor: 'success.solid', borderStyle: 'solid' },
  lost: { bg: 'blocker.subtle', borderColor: 'blocker.solid', borderStyle: 'dotted' },
} as const;

/**
 * One row per day at the site (its zone), the day's runs placed on a 24-hour track. Each block
 * carries its proposal's reference and status in words; a run across local midnight is shown to
 * the end of its first day.
 */
export function RunTimeline({ runs, timeZone }: { runs: PlanRun[]; timeZone: string }) {
  const days = new Map<string, PlanRun[]>();
  for (const r of runs) {
    const day = zonedDay(r.startsAt, timeZone);
    days.set(day, [...(days.get(day) ?? []), r]);
  }
  return (
    <Stack gap="1" role="list" aria-label={`Runs per day, site time (${timeZone})`}>
      <Grid templateColumns="7rem 1fr" gap="2" fontSize="xs" color="fg.muted" aria-hidden>
        <Text>{timeZone}</Text>
        <HStack justify="space-between">
          {[0, 6, 12, 18, 24].map((h) => (
            <Text key={h}>{String(h).padStart(2, '0')}:00</Text>
          ))}
        </HStack>
      </Grid>
      {[...days.entries()].map(([day, list]) => (
        <Grid key={day} templateColumns="7rem 1fr" gap="2" alignItems="center" role="listitem">
          <Text fontSize="sm" fontFamily="mono">
            {day}
          </Text>
          <Box position="relative" h="8" bg="bg.muted" rounded="sm">
            {list.map((r) => {
              const start = localMinutes(r.startsAt, timeZone);
              const length = Math.min(r.hours * 60, DAY_MINUTES - start);
              const style = STATUS_STYLE[r.status];
              const label = `${r.proposal.reference} ${r.target.name}, ${RUN_STATUS_LABELS[r.status]}${r.locked ? ', locked' : ''}: ${zonedText(r.startsAt, timeZone)} to ${zonedText(r.endsAt, timeZone)}, LST ${lstText(r.lstStartHours)}–${lstText(r.lstEndHours)}`;
              return (
                <Box
                  key={r.id}
                  position="absolute"
                  top="0.5"
                  bottom="0.5"
                  left={`${(start / DAY_MINUTES) * 100}%`}
                  w={`${Math.max((length / DAY_MINUTES) * 100, 0.6)}%`}
                  borderWidth="2px"
                  rounded="sm"
                  overflow="hidden"
                  px="1"
                  title={label}
                  aria-label={label}
                  role="img"
                  {...style}
                >
                  <HStack gap="0.5" fontSize="2xs" fontFamily="mono" overflow="hidden">
                    {r.locked && <Lock size={10} aria-hidden />}
                    <Text lineClamp={1}>{r.proposal.reference}</Text>
                  </HStack>
                </Box>
              );
            })}
          </Box>
        </Grid>
      ))}
    </Stack>
  );
}
