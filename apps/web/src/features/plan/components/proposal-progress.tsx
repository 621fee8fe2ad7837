import { Box, Heading, HStack, Progress as Bar, Stack, Text } from '@chakra-ui/react';
import type { Proposal } from '@/features/proposals/api';
import { useProgress } from '../hooks';
import { hoursText } from '../labels';

/**
 * On the proposal's page: progress of the granted time (granted, observed, remaining) per
 * observation. Nothing while there is nothing to show: before the outcomes are published, for a
 * proposal without granted hours, or when the progress cannot be read.
 */
export function ProposalProgress({ proposal }: { proposal: Proposal }) {
  const shows = !['draft', 'withdrawn', 'submitted', 'under_review'].includes(proposal.status);
  const query = useProgress(proposal.reference, shows);
  const progress = query.data;
  if (!shows || !progress || !progress.published || progress.observations.length === 0) return null;
  const { totals } = progress;
  return (
    <Box
      as="section"
      aria-labelledby="progress-heading"
      borderWidth="1px"
      rounded="md"
      p="4"
      mb="6"
    >
      <Stack gap="3">
        <HStack justify="space-between" wrap="wrap">
          <Heading as="h2" size="md" id="progress-heading">
            Observing progress
          </Heading>
          <Text fontSize="sm">
            {progress.completedAt
              ? 'Completed: everything granted has been observed'
              : `${hoursText(totals.observedHours)} observed of ${hoursText(totals.grantedHours)} granted, ${hoursText(totals.remainingHours)} remaining`}
          </Text>
        </HStack>
        {progress.observations.map((o) => {
          const value =
            o.grantedHours > 0 ? Math.min(100, (o.observedHours / o.grantedHours) * 100) : 0;
          const label = `Observation ${o.position}, ${o.targetName} (${o.configurationName})`;
          return (
            <Stack key={o.id} gap="1">
              <Bar.Root value={value} max={100} size="sm" colorPalette="success" aria-label={label}>
                <HStack justify="space-between" wrap="wrap">
                  <Bar.Label fontSize="sm">{label}</Bar.Label>
                  <Text fontSize="sm" color="fg.muted">
                    granted {hoursText(o.grantedHours)} · observed {hoursText(o.observedHours)} ·
                    remaining {hoursText(o.remainingHours)}
                    {o.plannedHours > 0 ? ` · ${hoursText(o.plannedHours)} planned` : ''}
                  </Text>
                </HStack>
                <Bar.Track>
                  <Bar.Range />
                </Bar.Track>
              </Bar.Root>
            </Stack>
          );
        })}
      </Stack>
    </Box>
  );
}
