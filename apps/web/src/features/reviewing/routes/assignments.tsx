import { Stack } from '@chakra-ui/react';
import { ClipboardCheck } from 'lucide-react';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { defineRoute } from '@/lib/route-module';
import { reviewListQueryOptions } from '../api';
import { AssignmentsTable } from '../components/assignments-table';
import { useReviews } from '../hooks';

function AssignmentsPage() {
  const reviews = useReviews();
  const now = new Date();
  return (
    <Stack>
      <PageHeader
        title="Reviewing"
        description="The proposals you are asked to review. Open one to read its PDF, declare a conflict or write your review."
      />
      {reviews.isPending ? (
        <PageLoader label="Loading your assignments…" />
      ) : reviews.isError ? (
        <LoadError
          error={reviews.error}
          what="your assignments"
          onRetry={() => void reviews.refetch()}
        />
      ) : reviews.data.items.length === 0 ? (
        <EmptyState
          icon={ClipboardCheck}
          title="No assignments yet"
          description="When a chair assigns you proposals to review, they appear here and you get an e-mail."
        />
      ) : (
        <AssignmentsTable items={reviews.data.items} now={now} />
      )}
    </Stack>
  );
}

export const route = defineRoute({
  Component: AssignmentsPage,
  loader: (queryClient) => () => queryClient.ensureQueryData(reviewListQueryOptions()),
});
