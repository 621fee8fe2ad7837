import { Box, Card, Heading, HStack, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router-dom';
import { callHref } from '@/lib/paths';
import type { Call } from '../api';
import { CallStatusBadge } from './call-status-badge';
import { Instant } from './instant';

const hours = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });

/** One open or upcoming call on the public list: what it offers and how long is left. */
export function CallCard({ call, now }: { call: Call; now: Date }) {
  const upcoming = !call.acceptingSubmissions;
  const headingId = `call-${call.code}-heading`;
  return (
    <Card.Root as="article" aria-labelledby={headingId} variant="outline">
      <Card.Body>
        <Stack gap="4">
          <HStack justify="space-between" align="start" gap="3" wrap="wrap">
            <Stack gap="1">
              <Text fontFamily="mono" fontSize="sm" color="fg.muted">
                {call.code} · {call.observatory.name}
              </Text>
              <Heading as="h3" size="lg" id={headingId}>
                <Link asChild color="fg" _hover={{ color: 'brand.fg' }}>
                  <RouterLink to={callHref(call.code)}>{call.title}</RouterLink>
                </Link>
              </Heading>
            </Stack>
            <CallStatusBadge call={call} />
          </HStack>
          <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
            {upcoming && (
              <Box>
                <Text fontSize="sm" color="fg.muted">
                  Opens
                </Text>
                <Instant at={call.opensAt} now={now} />
              </Box>
            )}
            <Box>
              <Text fontSize="sm" color="fg.muted">
                Deadline
              </Text>
              <Instant at={call.deadlineAt} now={now} />
            </Box>
            <Box>
              <Text fontSize="sm" color="fg.muted">
                On offer
              </Text>
              <Text fontWeight="medium">{hours.format(call.totalHours)} h</Text>
              <Text fontSize="sm" color="fg.muted">
                {call.capacity
                  .map((c) => `${c.configurationName} ${hours.format(c.hours)} h`)
                  .join(' · ')}
              </Text>
            </Box>
          </SimpleGrid>
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}
