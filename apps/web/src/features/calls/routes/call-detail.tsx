import { Box, Button, Card, Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { FilePlus2, Pencil } from 'lucide-react';
import { Link as RouterLink, useParams } from 'react-router-dom';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { canAccess } from '@/features/session/access';
import { useSession } from '@/features/session/hooks';
import { editCallHref, newProposalHref } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { type Call, callQueryOptions } from '../api';
import { CallRules } from '../components/call-rules';
import { CallStatusBadge } from '../components/call-status-badge';
import { CapacityTable } from '../components/capacity-table';
import { Instant } from '../components/instant';
import { LifecyclePanel } from '../components/lifecycle-panel';
import { QueryError } from '../components/query-error';
import { RolesPanel } from '../components/roles-panel';
import { useCall, useNow } from '../hooks';
import { STATUS_MEANINGS } from '../labels';

function KeyDates({ call }: { call: Call }) {
  const now = useNow();
  const dates: [string, string, boolean][] = [
    ['Opens', call.opensAt, !call.acceptingSubmissions && call.status === 'open'],
    ['Deadline', call.deadlineAt, call.status === 'open'],
    ['Reviews due', call.reviewDueAt, false],
  ];
  return (
    <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
      {dates.map(([label, at, counting]) => (
        <Box key={label}>
          <Text fontSize="sm" color="fg.muted">
            {label}
          </Text>
          <Instant at={at} callZone={call.timeZone} now={counting ? now : undefined} />
        </Box>
      ))}
    </SimpleGrid>
  );
}

function CallPage({ call }: { call: Call }) {
  const { session } = useSession();
  const staff = canAccess(session, 'staff');
  return (
    <>
      <PageHeader
        title={call.title}
        description={`${call.code} · ${call.observatory.name}`}
        actions={
          <>
            {call.acceptingSubmissions && (
              <Button asChild>
                <RouterLink to={newProposalHref(call.code)}>
                  <FilePlus2 aria-hidden /> Write a proposal
                </RouterLink>
              </Button>
            )}
            {staff && call.status !== 'archived' && (
              <Button asChild variant="outline">
                <RouterLink to={editCallHref(call.code)}>
                  <Pencil aria-hidden /> Edit call
                </RouterLink>
              </Button>
            )}
          </>
        }
      />
      <Stack gap="8">
        <Card.Root variant="subtle">
          <Card.Body>
            <Stack gap="4">
              <HStack gap="3" wrap="wrap">
                <CallStatusBadge call={call} />
                <Text color="fg.muted">{STATUS_MEANINGS[call.status]}</Text>
              </HStack>
              <KeyDates call={call} />
              <Text fontSize="sm" color="fg.muted">
                The call&apos;s dates are set in {call.timeZone}; shown here in your zone and in
                UTC.
              </Text>
            </Stack>
          </Card.Body>
        </Card.Root>

        {call.description && (
          <Text whiteSpace="pre-line" maxW="70ch">
            {call.description}
          </Text>
        )}

        <SimpleGrid columns={{ base: 1, lg: 2 }} gap="8" alignItems="start">
          <Stack as="section" aria-labelledby="rules-heading" gap="3">
            <Heading as="h2" size="lg" id="rules-heading">
              Rules
            </Heading>
            <CallRules call={call} />
          </Stack>
          <Stack as="section" aria-labelledby="capacity-heading" gap="3">
            <Heading as="h2" size="lg" id="capacity-heading">
              Time on offer
            </Heading>
            <CapacityTable capacity={call.capacity} totalHours={call.totalHours} />
          </Stack>
        </SimpleGrid>

        {staff && (
          <Stack gap="6">
            <LifecyclePanel call={call} />
            <RolesPanel call={call} />
          </Stack>
        )}
      </Stack>
    </>
  );
}

function CallDetailPage() {
  const { code = '' } = useParams();
  const query = useCall(code);
  if (query.isPending) return <PageLoader />;
  if (query.isError)
    return <QueryError error={query.error} onRetry={() => void query.refetch()} what="the call" />;
  return <CallPage call={query.data} />;
}

export const route = defineRoute({
  Component: CallDetailPage,
  loader:
    (queryClient) =>
    async ({ params }) => {
      await queryClient.ensureQueryData(callQueryOptions(params.code ?? ''));
      return null;
    },
});
