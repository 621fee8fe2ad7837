import { Badge, Box, Button, Grid, Heading, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { Download } from 'lucide-react';
import { Link as RouterLink, useParams } from 'react-router-dom';
import { LoadError } from '@/components/ui/load-error';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { reviewPdfUrl, reviewQueryOptions, type ReviewDetail } from '../api';
import { DueDate } from '../components/due-date';
import { ReasonDialog } from '../components/reason-dialog';
import { ReviewForm } from '../components/review-form';
import { ReviewStatusIndicator } from '../components/review-status';
import { useDeclareConflict, useDeclineReview, useReview } from '../hooks';

function ProposalPanel({ review }: { review: ReviewDetail }) {
  const closed = review.status === 'declined' || review.status === 'conflicted';
  return (
    <Stack gap="4" borderWidth="1px" rounded="md" p="4">
      <Heading as="h2" size="md">
        The proposal
      </Heading>
      <HStack gap="2" wrap="wrap">
        <Badge variant="outline">{review.scienceCategory}</Badge>
        <Badge variant="outline">{review.kind.replace(/_/g, ' ')}</Badge>
        <Text fontSize="sm" color="fg.muted">
          Version {review.versionNumber} · {review.totalHours} h asked
        </Text>
      </HStack>
      {review.call.anonymousReview && (
        <Text fontSize="sm" color="fg.muted">
          Review in this call is anonymous: the team is not shown.
        </Text>
      )}
      {closed ? (
        <Text color="fg.muted">
          You{' '}
          {review.status === 'declined'
            ? 'declined this assignment'
            : 'are in conflict with this proposal'}
          {review.declineReason || review.conflictReason
            ? ` (“${review.declineReason ?? review.conflictReason}”)`
            : ''}
          ; it is no longer yours to read.
        </Text>
      ) : (
        <>
          <Box>
            <Heading as="h3" size="sm" mb="1">
              Abstract
            </Heading>
            <Text whiteSpace="pre-wrap">{review.abstract || 'No abstract.'}</Text>
          </Box>
          <Button asChild variant="outline" alignSelf="start">
            <a href={reviewPdfUrl(review.id)} download>
              <Download aria-hidden /> Download the compiled PDF
            </a>
          </Button>
        </>
      )}
    </Stack>
  );
}

function ReviewPage() {
  const { assignmentId = '' } = useParams();
  const review = useReview(assignmentId);
  const decline = useDeclineReview(assignmentId);
  const conflict = useDeclareConflict(assignmentId);
  if (review.isPending) return <PageLoader label="Loading the review…" />;
  if (review.isError)
    return (
      <LoadError error={review.error} what="the review" onRetry={() => void review.refetch()} />
    );
  const r = review.data;
  const open = r.editable && r.status !== 'submitted';
  return (
    <Stack gap="6">
      <Link asChild fontSize="sm">
        <RouterLink to={paths.reviewing}>← All assignments</RouterLink>
      </Link>
      <PageHeader
        title={`${r.reference}: ${r.title || 'Untitled'}`}
        description={`Call ${r.call.code} · ${r.call.title}`}
        actions={
          open ? (
            <>
              <ReasonDialog
                trigger="Declare a conflict"
                title="Declare a conflict of interest"
                explanation="The chair sees your reason and the proposal goes to another referee. You cannot review it afterwards."
                confirmLabel="Declare the conflict"
                pending={conflict.isPending}
                onConfirm={(reason) => conflict.mutateAsync({ reason, version: r.version })}
              />
              <ReasonDialog
                trigger="Decline"
                title="Decline this assignment"
                explanation="The chair sees your reason and finds another referee. You cannot take it back yourself."
                confirmLabel="Decline"
                pending={decline.isPending}
                onConfirm={(reason) => decline.mutateAsync({ reason, version: r.version })}
              />
            </>
          ) : undefined
        }
      />
      <HStack gap="8" wrap="wrap">
        <Stack gap="1">
          <Text fontSize="sm" color="fg.muted">
            Status
          </Text>
          <ReviewStatusIndicator status={r.status} />
        </Stack>
        <Stack gap="1">
          <Text fontSize="sm" color="fg.muted">
            Due
          </Text>
          <DueDate at={r.call.reviewDueAt} now={new Date()} />
        </Stack>
      </HStack>
      <Grid templateColumns={{ base: '1fr', lg: '2fr 3fr' }} gap="6" alignItems="start">
        <ProposalPanel review={r} />
        {r.status === 'declined' || r.status === 'conflicted' ? null : (
          <Stack gap="3">
            <Heading as="h2" size="md">
              Your review
            </Heading>
            <ReviewForm review={r} />
          </Stack>
        )}
      </Grid>
    </Stack>
  );
}

export const route = defineRoute({
  Component: ReviewPage,
  loader:
    (queryClient) =>
    ({ params }) =>
      queryClient.ensureQueryData(reviewQueryOptions(params.assignmentId ?? '')),
});
