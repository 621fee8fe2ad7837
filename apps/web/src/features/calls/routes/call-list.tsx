import { Heading, Stack, Text } from '@chakra-ui/react';
import { CalendarClock, History } from 'lucide-react';
import { useState } from 'react';
import { EmptyState } from '@/components/ui/empty-state';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { defineRoute } from '@/lib/route-module';
import { viewerTimeZone } from '@/lib/time';
import { callListQueryOptions, type CallFilters } from '../api';
import { CallCard } from '../components/call-card';
import { CallsTable } from '../components/calls-table';
import { Pager } from '../components/pager';
import { QueryError } from '../components/query-error';
import { useCalls, useNow } from '../hooks';

/** Open calls, including those announced but not yet taking submissions. */
const OPEN: CallFilters = { status: ['open'], pageSize: 50 };
const EARLIER_STATUSES = ['closed', 'in_review', 'deliberation', 'published', 'archived'] as const;
const EARLIER_PAGE_SIZE = 10;

function OpenCalls() {
  const now = useNow();
  const query = useCalls(OPEN);
  if (query.isPending) return <BlockLoader label="Loading the open calls" lines={4} />;
  if (query.isError)
    return (
      <QueryError error={query.error} onRetry={() => void query.refetch()} what="the open calls" />
    );
  if (query.data.items.length === 0)
    return (
      <EmptyState
        icon={CalendarClock}
        title="No call is open right now"
        description="Calls are announced here when the observatory opens them."
      />
    );
  return (
    <Stack gap="4">
      {query.data.items.map((call) => (
        <CallCard key={call.code} call={call} now={now} />
      ))}
    </Stack>
  );
}

function EarlierCalls() {
  const [page, setPage] = useState(1);
  const query = useCalls({ status: EARLIER_STATUSES, page, pageSize: EARLIER_PAGE_SIZE });
  if (query.isPending) return <BlockLoader label="Loading the earlier calls" />;
  if (query.isError)
    return (
      <QueryError
        error={query.error}
        onRetry={() => void query.refetch()}
        what="the earlier calls"
      />
    );
  if (query.data.total === 0)
    return (
      <EmptyState
        icon={History}
        title="No earlier calls"
        description="Calls appear here once their deadline has passed."
      />
    );
  return (
    <>
      <CallsTable calls={query.data.items} caption="Earlier calls" />
      <Pager
        page={query.data.page}
        pageSize={query.data.pageSize}
        total={query.data.total}
        onPage={setPage}
        label="Pages of earlier calls"
      />
    </>
  );
}

function CallListPage() {
  return (
    <>
      <PageHeader
        title="Calls"
        description="Calls for proposals for observing time on the array."
      />
      <Stack gap="10">
        <Stack as="section" aria-labelledby="open-calls" gap="4">
          <Stack gap="1">
            <Heading as="h2" size="xl" id="open-calls">
              Open and upcoming
            </Heading>
            <Text color="fg.muted" fontSize="sm">
              Times are in your zone ({viewerTimeZone()}) and in UTC. The server&apos;s clock
              decides: a proposal must be submitted before the deadline.
            </Text>
          </Stack>
          <OpenCalls />
        </Stack>
        <Stack as="section" aria-labelledby="earlier-calls" gap="4">
          <Heading as="h2" size="xl" id="earlier-calls">
            Earlier calls
          </Heading>
          <EarlierCalls />
        </Stack>
      </Stack>
    </>
  );
}

export const route = defineRoute({
  Component: CallListPage,
  loader: (queryClient) => async () => {
    await queryClient.ensureQueryData(callListQueryOptions(OPEN));
    return null;
  },
});
