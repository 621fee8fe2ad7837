import { Button, HStack, IconButton, NativeSelect, Stack, Table, Text } from '@chakra-ui/react';
import { X } from 'lucide-react';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { isApiError } from '@/lib/api-client';
import type { AssignmentItem, CallRefereesResponse, ProposalAssignments } from '../api';
import { useAddAssignment, useRemoveAssignment } from '../hooks';
import { ReviewStatusIndicator } from './review-status';

const message = (e: unknown) => (isApiError(e) ? e.message : 'Something went wrong.');

function AddReferee({
  code,
  proposal,
  pool,
}: {
  code: string;
  proposal: ProposalAssignments;
  pool: CallRefereesResponse;
}) {
  const add = useAddAssignment(code);
  const [refereeId, setRefereeId] = useState('');
  const on = new Set(proposal.assignments.map((a) => a.refereeId));
  const free = pool.referees.filter(
    (r) => !on.has(r.userId) && !r.conflicts.some((c) => c.proposalId === proposal.proposalId),
  );
  if (free.length === 0)
    return (
      <Text fontSize="sm" color="fg.muted">
        No other referee is free of conflicts.
      </Text>
    );
  return (
    <Stack gap="1">
      <HStack gap="2">
        <NativeSelect.Root size="sm" maxW="16rem">
          <NativeSelect.Field
            aria-label={`Referee to add to ${proposal.reference}`}
            value={refereeId}
            onChange={(e) => setRefereeId(e.target.value)}
          >
            <option value="">Add a referee…</option>
            {free.map((r) => (
              <option key={r.userId} value={r.userId}>
                {r.name} ({r.load} assigned)
              </option>
            ))}
          </NativeSelect.Field>
          <NativeSelect.Indicator />
        </NativeSelect.Root>
        <Button
          size="sm"
          variant="outline"
          disabled={!refereeId}
          loading={add.isPending}
          onClick={() =>
            add.mutate(
              { proposalId: proposal.proposalId, refereeId },
              { onSuccess: () => setRefereeId('') },
            )
          }
        >
          Add
        </Button>
      </HStack>
      {add.isError && (
        <Text fontSize="sm" color="blocker.fg" role="alert">
          {message(add.error)}
        </Text>
      )}
    </Stack>
  );
}

/** Each proposal of the call with its referees; the chair adds and removes them by hand. */
export function ProposalAssignmentsTable({
  code,
  pool,
}: {
  code: string;
  pool: CallRefereesResponse;
}) {
  const remove = useRemoveAssignment(code);
  const [removing, setRemoving] = useState<{ item: AssignmentItem; reference: string } | null>(
    null,
  );
  return (
    <>
      <Table.ScrollArea borderWidth="1px" rounded="md">
        <Table.Root size="sm">
          <Table.Caption srOnly>Assignments per proposal</Table.Caption>
          <Table.Header>
            <Table.Row>
              <Table.ColumnHeader>Proposal</Table.ColumnHeader>
              <Table.ColumnHeader>Referees</Table.ColumnHeader>
              <Table.ColumnHeader>Needs</Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {pool.proposals.map((p) => (
              <Table.Row key={p.proposalId}>
                <Table.Cell verticalAlign="top">
                  <Text fontFamily="mono" fontWeight="medium">
                    {p.reference}
                  </Text>
                  <Text>{p.title || 'Untitled'}</Text>
                  <Text fontSize="xs" color="fg.muted">
                    {p.scienceCategory}
                    {p.piName ? ` · PI ${p.piName}` : ''}
                  </Text>
                </Table.Cell>
                <Table.Cell verticalAlign="top">
                  <Stack gap="2">
                    {p.assignments.length === 0 && <Text color="fg.muted">No referee yet</Text>}
                    {p.assignments.map((a) => (
                      <HStack key={a.id} gap="3" wrap="wrap">
                        <Text>{a.refereeName}</Text>
                        <ReviewStatusIndicator status={a.status} />
                        {a.declineReason && (
                          <Text fontSize="xs" color="fg.muted">
                            “{a.declineReason}”
                          </Text>
                        )}
                        {pool.canEdit && a.status !== 'submitted' && (
                          <IconButton
                            size="xs"
                            variant="ghost"
                            aria-label={`Remove ${a.refereeName} from ${p.reference}`}
                            onClick={() => setRemoving({ item: a, reference: p.reference })}
                          >
                            <X />
                          </IconButton>
                        )}
                      </HStack>
                    ))}
                    {pool.canEdit && <AddReferee code={code} proposal={p} pool={pool} />}
                  </Stack>
                </Table.Cell>
                <Table.Cell verticalAlign="top">
                  {p.missing === 0 ? (
                    <StatusIndicator tone="success">Complete</StatusIndicator>
                  ) : (
                    <StatusIndicator tone="warning">{p.missing} more</StatusIndicator>
                  )}
                </Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      <ConfirmDialog
        open={removing !== null}
        onOpenChange={(open) => !open && setRemoving(null)}
        title="Remove this referee?"
        confirmLabel="Remove"
        tone="danger"
        pending={remove.isPending}
        error={remove.isError ? message(remove.error) : null}
        onConfirm={() =>
          removing && remove.mutate(removing.item.id, { onSuccess: () => setRemoving(null) })
        }
      >
        <Text>
          {removing?.item.refereeName} comes off {removing?.reference}; any draft they wrote is
          deleted. You can add them again afterwards.
        </Text>
      </ConfirmDialog>
    </>
  );
}
