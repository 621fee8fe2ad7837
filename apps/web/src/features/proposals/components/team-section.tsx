import {
  Box,
  Button,
  chakra,
  Checkbox,
  Heading,
  HStack,
  Input,
  Stack,
  Switch,
  Table,
  Text,
} from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Crown, UserMinus } from 'lucide-react';
import { useEffect, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError, FormField } from '@/components/ui/form-field';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/form-errors';
import {
  inviteMember,
  makePi,
  type Proposal,
  removeMember,
  setMemberEditRight,
  type TeamMember,
} from '../api';
import { type FocusRequest, focusAfterNavigation } from '../focus';
import { useProposalWrite } from '../hooks';
import { apartFromFields } from '../issues';
import { ROLE_LABELS } from '../labels';
import { WriteError } from './write-error';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, TeamMember>();

const columns = helper.columns([
  helper.accessor('name', {
    header: 'Name',
    cell: (info) => <Text fontWeight="medium">{info.getValue() || '—'}</Text>,
  }),
  helper.accessor('email', { header: 'E-mail' }),
  helper.accessor('affiliation', {
    header: 'Affiliation',
    cell: (info) => info.getValue() || <Text color="fg.muted">not given yet</Text>,
  }),
  helper.accessor('role', { header: 'Role', cell: (info) => ROLE_LABELS[info.getValue()] }),
  helper.accessor('status', {
    header: 'Invitation',
    cell: (info) =>
      info.getValue() === 'accepted' ? (
        <StatusIndicator tone="success">Accepted</StatusIndicator>
      ) : (
        <StatusIndicator tone="note">Invited, not yet accepted</StatusIndicator>
      ),
  }),
]);

interface InviteValues {
  email: string;
  canEdit: boolean;
}

function InviteForm({ proposal }: { proposal: Proposal }) {
  const invite = useProposalWrite(proposal.reference, (version, input: InviteValues) =>
    inviteMember(proposal.reference, version, input),
  );
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors },
  } = useForm<InviteValues>({ defaultValues: { email: '', canEdit: false } });

  const onSubmit = handleSubmit((values) =>
    invite.mutate(
      { email: values.email.trim(), canEdit: values.canEdit },
      {
        onSuccess: () => {
          toaster.create({ type: 'success', title: `Invitation sent to ${values.email.trim()}` });
          reset();
        },
        onError: (error) => {
          if (isApiError(error, 400)) setServerErrors(error, setError, ['email', 'canEdit']);
        },
      },
    ),
  );

  return (
    <chakra.form onSubmit={onSubmit} noValidate aria-labelledby="invite-heading">
      <Stack gap="3" maxW="xl">
        <Heading as="h3" size="md" id="invite-heading">
          Invite a Co-I
        </Heading>
        <FormField
          label="E-mail address"
          error={errors.email}
          required
          helperText="They get an e-mail with a link; an address without an account can register from it."
        >
          <Input
            type="email"
            autoComplete="off"
            {...register('email', {
              validate: (value) =>
                /^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(value.trim()) || 'Give an e-mail address.',
            })}
          />
        </FormField>
        <Controller
          control={control}
          name="canEdit"
          render={({ field }) => (
            <Checkbox.Root
              checked={field.value}
              onCheckedChange={(details) => field.onChange(details.checked === true)}
            >
              <Checkbox.HiddenInput name={field.name} onBlur={field.onBlur} />
              <Checkbox.Control />
              <Checkbox.Label>May edit the proposal</Checkbox.Label>
            </Checkbox.Root>
          )}
        />
        <FormError error={errors.root?.server} />
        <WriteError error={apartFromFields(invite.error)} reference={proposal.reference} />
        <HStack>
          <Button type="submit" loading={invite.isPending}>
            Send the invitation
          </Button>
        </HStack>
      </Stack>
    </chakra.form>
  );
}

type Pending = { kind: 'remove' | 'make-pi'; member: TeamMember } | null;

function MemberActions({
  member,
  onEditRight,
  onAsk,
  busy,
}: {
  member: TeamMember;
  onEditRight: (member: TeamMember, canEdit: boolean) => void;
  onAsk: (pending: Pending) => void;
  busy: boolean;
}) {
  if (member.role === 'pi') {
    return (
      <Text fontSize="sm" color="fg.muted">
        The PI always edits
      </Text>
    );
  }
  const who = member.name || member.email;
  return (
    <HStack gap="3" justify="end" wrap="wrap">
      <Switch.Root
        size="sm"
        checked={member.canEdit}
        disabled={busy}
        onCheckedChange={(details) => onEditRight(member, details.checked)}
      >
        <Switch.HiddenInput />
        <Switch.Control />
        {/* A fixed name: the switch itself says on or off. */}
        <Switch.Label>
          Edit right
          <Box as="span" srOnly>
            {` for ${who}`}
          </Box>
        </Switch.Label>
      </Switch.Root>
      {member.status === 'accepted' && (
        <Button size="xs" variant="outline" onClick={() => onAsk({ kind: 'make-pi', member })}>
          <Crown aria-hidden /> Make PI
        </Button>
      )}
      <Button
        size="xs"
        variant="outline"
        colorPalette="blocker"
        onClick={() => onAsk({ kind: 'remove', member })}
        aria-label={`Remove ${who}`}
      >
        <UserMinus aria-hidden /> Remove
      </Button>
    </HStack>
  );
}

export function TeamSection({
  proposal,
  editable,
  focus,
}: {
  proposal: Proposal;
  editable: boolean;
  focus?: FocusRequest;
}) {
  const { reference } = proposal;
  const isPi = proposal.myAccess.role === 'pi';
  const manage = editable && isPi;
  const [pending, setPending] = useState<Pending>(null);

  const editRight = useProposalWrite(
    reference,
    (version, input: { id: string; canEdit: boolean }) =>
      setMemberEditRight(reference, version, input.id, input.canEdit),
  );
  const remove = useProposalWrite(reference, (version, member: TeamMember) =>
    removeMember(reference, version, member.id),
  );
  const reinvite = useProposalWrite(reference, (version, member: TeamMember) =>
    inviteMember(reference, version, { email: member.email, canEdit: member.canEdit }),
  );
  const handOver = useProposalWrite(reference, (version, member: TeamMember) =>
    makePi(reference, version, member.id),
  );

  useEffect(() => {
    if (!focus || !manage) return;
    return focusAfterNavigation(() =>
      document.querySelector<HTMLInputElement>('input[name="email"]')?.focus(),
    );
  }, [focus, manage]);

  const table = useTable({
    features,
    columns,
    data: proposal.team,
    getRowId: (member) => member.id,
  });

  const confirm = () => {
    if (!pending) return;
    const { member } = pending;
    const who = member.name || member.email;
    if (pending.kind === 'remove') {
      remove.mutate(member, {
        onSuccess: () => {
          setPending(null);
          // Undo invites them again with the same right; they accept again from the e-mail.
          toaster.create({
            type: 'info',
            title: `${who} is off the team`,
            duration: 10_000,
            action: {
              label: 'Undo',
              onClick: () =>
                reinvite.mutate(member, {
                  onSuccess: () =>
                    toaster.create({ type: 'success', title: `${who} is invited again` }),
                  onError: (error) =>
                    toaster.create({
                      type: 'error',
                      title: `Could not invite ${who} again`,
                      description: error.message,
                    }),
                }),
            },
          });
        },
      });
    } else {
      handOver.mutate(member, {
        onSuccess: () => {
          setPending(null);
          toaster.create({ type: 'success', title: `${who} is now the PI` });
        },
      });
    }
  };
  const confirming = pending?.kind === 'remove' ? remove : handOver;
  const pendingName = pending ? pending.member.name || pending.member.email : '';

  return (
    <Stack gap="6">
      {!isPi && (
        <Text color="fg.muted">
          Only the PI invites, removes and changes the rights of team members.
        </Text>
      )}
      <Table.ScrollArea borderWidth="1px" rounded="md">
        <Table.Root size="sm">
          <Table.Caption srOnly>Team</Table.Caption>
          <Table.Header>
            {table.getHeaderGroups().map((group) => (
              <Table.Row key={group.id}>
                {group.headers.map((header) => (
                  <Table.ColumnHeader key={header.id}>
                    <table.FlexRender header={header} />
                  </Table.ColumnHeader>
                ))}
                <Table.ColumnHeader textAlign="end">
                  {manage ? 'Edit right and actions' : 'Edit right'}
                </Table.ColumnHeader>
              </Table.Row>
            ))}
          </Table.Header>
          <Table.Body>
            {table.getRowModel().rows.map((row) => (
              <Table.Row key={row.id}>
                {row.getAllCells().map((cell) => (
                  <Table.Cell key={cell.id}>
                    <table.FlexRender cell={cell} />
                  </Table.Cell>
                ))}
                <Table.Cell textAlign="end">
                  {manage ? (
                    <MemberActions
                      member={row.original}
                      busy={editRight.isPending}
                      onEditRight={(member, canEdit) =>
                        editRight.mutate({ id: member.id, canEdit })
                      }
                      onAsk={setPending}
                    />
                  ) : (
                    <Text fontSize="sm">
                      {row.original.role === 'pi' || row.original.canEdit
                        ? 'May edit'
                        : 'Reads only'}
                    </Text>
                  )}
                </Table.Cell>
              </Table.Row>
            ))}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      <WriteError error={editRight.error ?? reinvite.error} reference={reference} />
      {manage && <InviteForm proposal={proposal} />}

      <ConfirmDialog
        open={pending !== null}
        onOpenChange={(open) => {
          if (!open) {
            setPending(null);
            remove.reset();
            handOver.reset();
          }
        }}
        title={
          pending?.kind === 'remove' ? `Remove ${pendingName}?` : `Make ${pendingName} the PI?`
        }
        confirmLabel={pending?.kind === 'remove' ? 'Remove from the team' : 'Hand over the PI role'}
        tone={pending?.kind === 'remove' ? 'danger' : 'default'}
        pending={confirming.isPending}
        error={confirming.error?.message}
        onConfirm={confirm}
      >
        {pending?.kind === 'remove' ? (
          <Text>
            {pendingName} will no longer see or edit this proposal. You can undo this for a few
            seconds afterwards; later, invite them again.
          </Text>
        ) : (
          <Text>
            {pendingName} becomes the principal investigator and manages the team. You stay on the
            team as a Co-I; only the new PI can hand the role back.
          </Text>
        )}
      </ConfirmDialog>
    </Stack>
  );
}
