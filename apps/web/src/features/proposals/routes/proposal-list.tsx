import { Button, Stack, Text } from '@chakra-ui/react';
import { FilePlus2 } from 'lucide-react';
import { useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ListPager } from '@/components/ui/list-pager';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { newProposalHref, paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { viewerTimeZone } from '@/lib/time';
import { proposalListQueryOptions } from '../api';
import { ProposalsTable } from '../components/proposals-table';
import { useNow, useProposals } from '../hooks';

const PAGE_SIZE = 20;

function ProposalListPage() {
  const [page, setPage] = useState(1);
  const now = useNow();
  const query = useProposals({ page, pageSize: PAGE_SIZE });

  const start = (
    <Button asChild>
      <RouterLink to={newProposalHref()}>
        <FilePlus2 aria-hidden /> Start a proposal
      </RouterLink>
    </Button>
  );

  let body;
  if (query.isPending) body = <BlockLoader label="Loading your proposals" lines={5} />;
  else if (query.isError)
    body = (
      <LoadError error={query.error} what="your proposals" onRetry={() => void query.refetch()} />
    );
  else if (query.data.total === 0)
    body = (
      <EmptyState
        icon={FilePlus2}
        title="No proposals yet"
        description="Write your first one for an open call: the call's page says what it offers and by when."
        action={
          <Stack direction={{ base: 'column', sm: 'row' }} gap="3">
            <Button asChild>
              <RouterLink to={newProposalHref()}>Start a proposal</RouterLink>
            </Button>
            <Button asChild variant="outline">
              <RouterLink to={paths.calls}>See the open calls</RouterLink>
            </Button>
          </Stack>
        }
      />
    );
  else
    body = (
      <Stack gap="2">
        <ProposalsTable proposals={query.data.items} now={now} />
        <Text fontSize="sm" color="fg.muted">
          Deadlines count down to the call&apos;s deadline; times are in your zone (
          {viewerTimeZone()}), with UTC on hover.
        </Text>
        <ListPager
          page={query.data.page}
          pageSize={query.data.pageSize}
          total={query.data.total}
          onPage={setPage}
          label="Pages of your proposals"
          noun="proposals"
        />
      </Stack>
    );

  return (
    <>
      <PageHeader
        title="Proposals"
        description="Every proposal you are on, in every call."
        actions={query.data && query.data.total > 0 ? start : undefined}
      />
      {body}
    </>
  );
}

export const route = defineRoute({
  Component: ProposalListPage,
  loader: (queryClient) => async () => {
    await queryClient.ensureQueryData(proposalListQueryOptions({ page: 1, pageSize: PAGE_SIZE }));
    return null;
  },
});
