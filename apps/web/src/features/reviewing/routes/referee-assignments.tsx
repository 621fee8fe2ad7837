import { Alert, Button, Heading, Stack, Text } from '@chakra-ui/react';
import { Users } from 'lucide-react';
import { useParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { defineRoute } from '@/lib/route-module';
import { formatLocalAndUtc } from '@/lib/time';
import { callRefereesQueryOptions } from '../api';
import { PoolTable } from '../components/pool-table';
import { ProposalAssignmentsTable } from '../components/proposal-assignments';
import { useAutoAssign, useCallReferees } from '../hooks';

function RefereeAssignmentsPage() {
  const { code = '' } = useParams();
  const pool = useCallReferees(code);
  const auto = useAutoAssign(code);
  if (pool.isPending) return <PageLoader label="Loading the referees…" />;
  if (pool.isError)
    return <LoadError error={pool.error} what="the referees" onRetry={() => void pool.refetch()} />;
  const p = pool.data;
  const due = formatLocalAndUtc(p.call.reviewDueAt);
  const missing = p.proposals.reduce((n, x) => n + x.missing, 0);
  return (
    <Stack gap="6">
      <PageHeader
        title={`Referees of ${p.call.code}`}
        description={`${p.call.refereesPerProposal} referees per proposal · reviews due ${due.local} (${due.utc})${p.call.anonymousReview ? ' · anonymous review' : ''}`}
        actions={
          p.canEdit ? (
            <Button
              colorPalette="brand"
              loading={auto.isPending}
              disabled={missing === 0}
              onClick={() =>
                auto.mutate(undefined, {
                  onSuccess: (answer) =>
                    toaster.create({
                      type: 'success',
                      title: `${answer.created} assignment${answer.created === 1 ? '' : 's'} made; referees are e-mailed`,
                    }),
                })
              }
            >
              Assign automatically
            </Button>
          ) : undefined
        }
      />
      {auto.isError && (
        <Alert.Root status="error" colorPalette="blocker" role="alert">
          <Alert.Indicator />
          <Alert.Title>
            {isApiError(auto.error) ? auto.error.message : 'The pass failed.'}
          </Alert.Title>
        </Alert.Root>
      )}
      {!p.canEdit && (
        <Text color="fg.muted">
          You can look at the assignments; only the chair of {p.call.code} changes them, after the
          deadline and before deliberation.
        </Text>
      )}
      <Stack gap="3">
        <Heading as="h2" size="md">
          Proposals ({p.proposals.length}, {missing} referee places open)
        </Heading>
        {p.proposals.length === 0 ? (
          <EmptyState
            icon={Users}
            title="No submitted proposals"
            description="Nothing to review in this call."
          />
        ) : (
          <ProposalAssignmentsTable code={code} pool={p} />
        )}
      </Stack>
      <Stack gap="3">
        <Heading as="h2" size="md">
          Pool ({p.referees.length} referees)
        </Heading>
        {p.referees.length === 0 ? (
          <EmptyState
            icon={Users}
            title="No referees yet"
            description="Staff invite referees from the call's page."
          />
        ) : (
          <PoolTable referees={p.referees} />
        )}
      </Stack>
    </Stack>
  );
}

export const route = defineRoute({
  Component: RefereeAssignmentsPage,
  loader:
    (queryClient) =>
    ({ params }) =>
      queryClient.ensureQueryData(callRefereesQueryOptions(params.code ?? '')),
});
