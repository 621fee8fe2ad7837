import {
  Button,
  Card,
  Heading,
  HStack,
  Link,
  SimpleGrid,
  Stack,
  Table,
  Text,
} from '@chakra-ui/react';
import { Download, Send } from 'lucide-react';
import { type ReactNode, useRef, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/features/session/hooks';
import { isApiError } from '@/lib/api-client';
import { paths, proposalHref } from '@/lib/paths';
import { formatCountdown, formatInstant, formatLocalAndUtc } from '@/lib/time';
import { changeLifecycle, compiledPdfUrl, type LifecycleAction, type Proposal } from '../api';
import { formatHours } from '../format';
import { useChecks, useNow, useObservatory, useProposalWrite } from '../hooks';
import { plural } from '../labels';
import { ProposalStatusIndicator } from './proposal-status';
import { VersionsPanel } from './versions-panel';

function HoursSummary({ proposal }: { proposal: Proposal }) {
  const observatory = useObservatory(proposal.call.observatoryId);
  const byConfiguration = new Map<string, number>();
  for (const o of proposal.observations) {
    byConfiguration.set(
      o.configurationId,
      (byConfiguration.get(o.configurationId) ?? 0) + o.hoursAsked,
    );
  }
  const total = [...byConfiguration.values()].reduce((sum, hours) => sum + hours, 0);
  const limit = proposal.call.maxHoursPerProposal;
  const name = (id: string) =>
    observatory.data?.configurations.find((c) => c.id === id)?.name ?? '…';
  return (
    <Stack gap="3">
      <Heading as="h3" size="md">
        Hours asked
      </Heading>
      {byConfiguration.size === 0 ? (
        <Text color="fg.muted">No observations yet.</Text>
      ) : (
        <Table.Root size="sm" variant="outline" maxW="md">
          <Table.Caption srOnly>Hours asked per configuration</Table.Caption>
          <Table.Header>
            <Table.Row>
              <Table.ColumnHeader>Configuration</Table.ColumnHeader>
              <Table.ColumnHeader textAlign="end">Hours</Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {[...byConfiguration].map(([id, hours]) => (
              <Table.Row key={id}>
                <Table.Cell>{name(id)}</Table.Cell>
                <Table.Cell textAlign="end" fontVariantNumeric="tabular-nums">
                  {formatHours(hours)}
                </Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
          <Table.Footer>
            <Table.Row>
              <Table.ColumnHeader>Total</Table.ColumnHeader>
              <Table.Cell
                textAlign="end"
                fontWeight="semibold"
                fontVariantNumeric="tabular-nums"
                data-quantity="total-hours"
              >
                {formatHours(total)}
              </Table.Cell>
            </Table.Row>
          </Table.Footer>
        </Table.Root>
      )}
      {total > limit ? (
        <StatusIndicator tone="blocker">
          {formatHours(total)} is more than the {formatHours(limit)} a proposal may ask for in this
          call.
        </StatusIndicator>
      ) : (
        <Text fontSize="sm" color="fg.muted">
          A proposal in this call may ask for at most {formatHours(limit)}.
        </Text>
      )}
    </Stack>
  );
}

function DeadlineCard({ proposal, now }: { proposal: Proposal; now: Date }) {
  const { deadline, timeZone } = proposal.call;
  const { local, utc } = formatLocalAndUtc(deadline);
  const passed = new Date(deadline).getTime() <= now.getTime();
  return (
    <Stack gap="1">
      <Heading as="h3" size="md">
        Deadline
      </Heading>
      <Text fontWeight="medium">
        <time dateTime={deadline}>{local}</time>
      </Text>
      <Text fontSize="sm" color="fg.muted">
        {utc} · {formatInstant(deadline, { timeZone })} in the call&apos;s zone ({timeZone})
      </Text>
      {passed ? (
        <StatusIndicator tone="warning">The deadline has passed</StatusIndicator>
      ) : (
        <Text fontSize="sm">{formatCountdown(deadline, now)}</Text>
      )}
    </Stack>
  );
}

type Asking = LifecycleAction | null;

const QUESTIONS: Record<
  LifecycleAction,
  { title: string; label: string; body: string; done: string }
> = {
  submit: {
    title: 'Submit the proposal?',
    label: 'Submit',
    body: 'This freezes the proposal as a version with its compiled PDF, and e-mails the team a receipt. Before the deadline you can still reopen it, change it and submit again.',
    done: 'Submitted: the receipt is on its way',
  },
  reopen: {
    title: 'Reopen the proposal to edit?',
    label: 'Reopen to edit',
    body: 'It goes back to draft. The submitted version is kept, but the proposal counts as submitted only once you submit it again before the deadline.',
    done: 'Reopened: it is a draft again',
  },
  withdraw: {
    title: 'Withdraw the proposal?',
    label: 'Withdraw',
    body: 'The proposal leaves the call and will not be reviewed. The team is told by e-mail.',
    done: 'Withdrawn',
  },
};

export function SubmitSection({ proposal, editable }: { proposal: Proposal; editable: boolean }) {
  const { reference, status } = proposal;
  const now = useNow();
  const { session } = useSession();
  const checks = useChecks(reference);
  const [asking, setAsking] = useState<Asking>(null);
  // A second click lands before React re-renders the disabled button: this guard holds it.
  const sending = useRef(false);
  const change = useProposalWrite(reference, (version, action: LifecycleAction) =>
    changeLifecycle(reference, version, action),
  );

  const passed = new Date(proposal.call.deadline).getTime() <= now.getTime();
  const canWrite = proposal.myAccess.canEdit;
  const blockers = checks.data?.items.filter((item) => item.level === 'blocker').length;

  const confirm = () => {
    if (!asking || sending.current) return;
    sending.current = true;
    const action = asking;
    change.mutate(action, {
      onSuccess: () => {
        setAsking(null);
        toaster.create({ type: 'success', title: QUESTIONS[action].done });
      },
      onSettled: () => {
        sending.current = false;
      },
    });
  };

  let reason: ReactNode = null;
  if (!canWrite) reason = 'Only the PI or a Co-I with the edit right can submit.';
  else if (passed) reason = 'The deadline has passed: the call takes no more submissions.';
  else if (session && !session.emailVerified)
    reason = (
      <>
        Confirm your e-mail address first (see{' '}
        <Link asChild>
          <RouterLink to={paths.profile}>your profile</RouterLink>
        </Link>
        ).
      </>
    );
  else if (checks.isPending) reason = 'Checking the proposal…';
  else if (checks.isError) reason = 'The checks could not be loaded; reload the page to try again.';
  else if (blockers !== undefined && blockers > 0)
    reason = (
      <>
        {plural(blockers, 'blocker')} must be cleared first:{' '}
        <Link asChild>
          <RouterLink to={proposalHref(reference, 'checks')}>see the checks</RouterLink>
        </Link>
        .
      </>
    );

  const errorText = (() => {
    const error = change.error;
    if (!error) return null;
    if (isApiError(error, 409) && error.code === 'STALE_VERSION')
      return 'Someone else changed this proposal meanwhile. Close this, look at their changes, and try again.';
    return error.message;
  })();

  return (
    <Stack gap="8">
      <Card.Root variant="subtle">
        <Card.Body>
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="8">
            <HoursSummary proposal={proposal} />
            <DeadlineCard proposal={proposal} now={now} />
          </SimpleGrid>
        </Card.Body>
      </Card.Root>

      {status === 'draft' ? (
        <Stack gap="3" as="section" aria-labelledby="submit-heading">
          <Heading as="h3" size="md" id="submit-heading">
            Submission
          </Heading>
          {proposal.submittedVersion !== null && (
            <StatusIndicator tone="warning">
              Reopened: version {proposal.submittedVersion} was submitted, but this draft is not
              until you submit it again.
            </StatusIndicator>
          )}
          <HStack gap="3" wrap="wrap">
            <Button
              onClick={() => setAsking('submit')}
              disabled={reason !== null}
              aria-describedby={reason ? 'submit-reason' : undefined}
            >
              <Send aria-hidden /> Submit the proposal
            </Button>
            {reason ? (
              <Text id="submit-reason" color="fg.muted" fontSize="sm">
                {reason}
              </Text>
            ) : (
              <StatusIndicator tone="success" fontSize="sm">
                No blockers: ready to submit
              </StatusIndicator>
            )}
          </HStack>
        </Stack>
      ) : (
        <Stack gap="4" as="section" aria-labelledby="submitted-heading">
          <Heading as="h3" size="md" id="submitted-heading">
            Status
          </Heading>
          <HStack gap="3" wrap="wrap">
            <ProposalStatusIndicator status={status} />
            {proposal.submittedAt && (
              <Text color="fg.muted">
                version {proposal.submittedVersion} on{' '}
                <time dateTime={proposal.submittedAt}>{formatInstant(proposal.submittedAt)}</time>
              </Text>
            )}
          </HStack>
          {proposal.submittedVersion !== null && (
            <Link href={compiledPdfUrl(reference)} alignSelf="start" fontWeight="medium">
              <Download aria-hidden size="16" /> The compiled PDF (cover and science case)
            </Link>
          )}
          {status === 'submitted' && canWrite && (
            <HStack gap="3" wrap="wrap">
              {!passed && (
                <Button variant="outline" onClick={() => setAsking('reopen')}>
                  Reopen to edit
                </Button>
              )}
              <Button
                variant="outline"
                colorPalette="blocker"
                onClick={() => setAsking('withdraw')}
              >
                Withdraw
              </Button>
              {passed && (
                <Text fontSize="sm" color="fg.muted">
                  The deadline has passed, so it can no longer be reopened.
                </Text>
              )}
            </HStack>
          )}
        </Stack>
      )}

      {proposal.submittedVersion !== null && <VersionsPanel reference={reference} />}

      {!editable && status === 'draft' && !canWrite && (
        <Text color="fg.muted">
          You can read this proposal; the PI decides when it is submitted.
        </Text>
      )}

      <ConfirmDialog
        open={asking !== null}
        onOpenChange={(open) => {
          if (!open && !change.isPending) {
            setAsking(null);
            change.reset();
          }
        }}
        title={asking ? QUESTIONS[asking].title : ''}
        confirmLabel={asking ? QUESTIONS[asking].label : ''}
        tone={asking === 'withdraw' ? 'danger' : 'default'}
        pending={change.isPending}
        error={errorText}
        onConfirm={confirm}
      >
        <Text>{asking ? QUESTIONS[asking].body : ''}</Text>
      </ConfirmDialog>
    </Stack>
  );
}
