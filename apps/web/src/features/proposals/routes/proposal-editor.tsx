import { Alert, Box, Button, Grid, Heading, Stack } from '@chakra-ui/react';
import { SearchX } from 'lucide-react';
import { useEffect, useRef } from 'react';
import { Link as RouterLink, useLocation, useParams, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/lib/paths';
import { formatCountdown } from '@/lib/time';
import { defineRoute } from '@/lib/route-module';
import { type Proposal, proposalQueryOptions } from '../api';
import { ProposalProgress } from '@/features/plan/components/proposal-progress';
import { ProposalOutcome } from '@/features/standing/components/proposal-outcome';
import { ChecksSection } from '../components/checks-section';
import { DocumentsSection } from '../components/documents-section';
import { ObservationsSection } from '../components/observations-section';
import { OverviewSection } from '../components/overview-section';
import { ProposalStatusIndicator } from '../components/proposal-status';
import { SectionNav } from '../components/section-nav';
import { SubmitSection } from '../components/submit-section';
import { TeamSection } from '../components/team-section';
import { focusAfterNavigation, focusRequestOf } from '../focus';
import { useChecks, useNow, useProposal } from '../hooks';
import { isSection, sectionLabel, STATUS_LABELS, type SectionId } from '../labels';

/** Why the proposal cannot be changed here, or null when it can. */
function readOnlyReason(proposal: Proposal, now: Date): string | null {
  if (proposal.status === 'draft') {
    return proposal.myAccess.canEdit
      ? null
      : 'You are a Co-I without the edit right, so you can read this proposal but not change it. The PI can give you the right in Team.';
  }
  if (proposal.status === 'submitted') {
    const open = new Date(proposal.call.deadline).getTime() > now.getTime();
    return open && proposal.myAccess.canEdit
      ? 'This proposal is submitted, so it is shown as it was sent. To change it, reopen it in Submit (possible until the deadline).'
      : 'This proposal is submitted, so it is shown as it was sent and can no longer be changed.';
  }
  return `This proposal is ${STATUS_LABELS[proposal.status].toLowerCase()}, so it can no longer be changed.`;
}

function Editor({ proposal, section }: { proposal: Proposal; section: SectionId }) {
  const now = useNow();
  const location = useLocation();
  const [search] = useSearchParams();
  const checks = useChecks(proposal.reference);
  const heading = useRef<HTMLHeadingElement>(null);
  const first = useRef(true);
  const focus = focusRequestOf(search, location.key);
  const reason = readOnlyReason(proposal, now);
  const editable = reason === null;

  // Moving between sections puts the keyboard and screen reader at the new section's heading,
  // unless a link asked for a particular field.
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    if (!focus) return focusAfterNavigation(() => heading.current?.focus());
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [section]);

  const blockers = checks.data?.items.filter((item) => item.level === 'blocker').length;
  const { call } = proposal;

  let content;
  switch (section) {
    case 'overview':
      content = <OverviewSection proposal={proposal} editable={editable} focus={focus} />;
      break;
    case 'team':
      content = <TeamSection proposal={proposal} editable={editable} focus={focus} />;
      break;
    case 'observations':
      content = <ObservationsSection proposal={proposal} editable={editable} focus={focus} />;
      break;
    case 'documents':
      content = <DocumentsSection proposal={proposal} editable={editable} focus={focus} />;
      break;
    case 'checks':
      content = <ChecksSection proposal={proposal} />;
      break;
    case 'submit':
      content = <SubmitSection proposal={proposal} editable={editable} />;
      break;
  }

  return (
    <>
      <PageHeader
        title={proposal.title || 'Untitled proposal'}
        description={`${proposal.reference} · ${call.code}, ${call.title} · deadline ${formatCountdown(call.deadline, now)}`}
        actions={<ProposalStatusIndicator status={proposal.status} />}
      />
      {reason && (
        <Alert.Root status="info" colorPalette="note" mb="6" role="note">
          <Alert.Indicator />
          <Alert.Title fontWeight="normal">{reason}</Alert.Title>
        </Alert.Root>
      )}
      <ProposalOutcome proposal={proposal} />
      <ProposalProgress proposal={proposal} />
      <Grid
        // minmax(0, …): a wide table or the row of section links scrolls in its column
        // instead of widening the page.
        templateColumns={{ base: 'minmax(0, 1fr)', md: '12rem minmax(0, 1fr)' }}
        gap={{ base: '4', md: '8' }}
      >
        <Box position={{ md: 'sticky' }} top={{ md: '4' }} alignSelf="start" minW="0">
          <SectionNav reference={proposal.reference} current={section} blockers={blockers} />
        </Box>
        <Stack as="section" aria-labelledby="editor-section-heading" gap="5" minW="0">
          <Heading
            as="h2"
            size="xl"
            id="editor-section-heading"
            ref={heading}
            tabIndex={-1}
            _focusVisible={{
              outline: '2px solid',
              outlineColor: 'colorPalette.focusRing',
              outlineOffset: '2px',
            }}
          >
            {sectionLabel(section)}
          </Heading>
          {content}
        </Stack>
      </Grid>
    </>
  );
}

function ProposalEditorPage() {
  const { reference = '', section } = useParams();
  const query = useProposal(reference);
  if (query.isPending) return <PageLoader label="Loading the proposal…" />;
  if (query.isError) {
    if (isApiError(query.error, 404)) {
      return (
        <>
          <PageHeader title="Proposal not found" />
          <EmptyState
            icon={SearchX}
            title={`No proposal ${reference} for you`}
            description="Either it does not exist or you are not on its team."
            action={
              <Button asChild variant="outline">
                <RouterLink to={paths.proposals}>Your proposals</RouterLink>
              </Button>
            }
          />
        </>
      );
    }
    return (
      <LoadError error={query.error} what="the proposal" onRetry={() => void query.refetch()} />
    );
  }
  return <Editor proposal={query.data} section={isSection(section) ? section : 'overview'} />;
}

export const route = defineRoute({
  Component: ProposalEditorPage,
  loader:
    (queryClient) =>
    async ({ params }) => {
      // A missing or foreign proposal is the screen's to explain, not the router's error page.
      await queryClient.prefetchQuery(proposalQueryOptions(params.reference ?? ''));
      return null;
    },
});
