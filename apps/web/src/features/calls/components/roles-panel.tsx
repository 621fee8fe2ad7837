import {
  Badge,
  Button,
  Card,
  Heading,
  HStack,
  IconButton,
  Input,
  NativeSelect,
  Stack,
  Table,
  Text,
  VisuallyHidden,
} from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Trash2, UserPlus } from 'lucide-react';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError, FormField } from '@/components/ui/form-field';
import { BlockLoader } from '@/components/ui/loading';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import { formatInstant } from '@/lib/time';
import type { Call, CallRoleHolder, CallRoleName } from '../api';
import { useCallRoles, useGrantCallRole, useRevokeCallRole } from '../hooks';
import { QueryError } from './query-error';

const ROLE_LABELS: Record<CallRoleName, string> = {
  chair: 'Chair',
  referee: 'Referee',
};

type Row = CallRoleHolder & { callCode: string };

function RemoveRole({ holder }: { holder: Row }) {
  const [open, setOpen] = useState(false);
  const revoke = useRevokeCallRole(holder.callCode);
  const who = holder.name ? `${holder.name} (${holder.email})` : holder.email;
  const what = holder.state === 'pending' ? 'the invitation of' : 'the role of';
  return (
    <>
      <IconButton
        aria-label={`Remove ${ROLE_LABELS[holder.role].toLowerCase()} ${holder.email}`}
        variant="ghost"
        size="sm"
        onClick={() => {
          revoke.reset();
          setOpen(true);
        }}
      >
        <Trash2 />
      </IconButton>
      <ConfirmDialog
        open={open}
        onOpenChange={setOpen}
        tone="danger"
        title={`Remove ${ROLE_LABELS[holder.role].toLowerCase()}?`}
        confirmLabel="Remove"
        pending={revoke.isPending}
        error={revoke.error?.message}
        onConfirm={() =>
          revoke.mutate(holder.id, {
            onSuccess: () => {
              setOpen(false);
              toaster.create({ type: 'success', title: `Removed ${holder.email}` });
            },
          })
        }
      >
        <Text>
          This takes away {what} {ROLE_LABELS[holder.role].toLowerCase()} from {who} in call{' '}
          {holder.callCode}. They are not told; you can invite them again.
        </Text>
      </ConfirmDialog>
    </>
  );
}

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, Row>();
const columns = helper.columns([
  helper.accessor('email', {
    header: 'Person',
    cell: ({ row }) => (
      <Stack gap="0">
        <Text fontWeight="medium">{row.original.name ?? 'No account yet'}</Text>
        <Text fontSize="sm" color="fg.muted">
          {row.original.email}
        </Text>
      </Stack>
    ),
  }),
  helper.accessor('role', { header: 'Role', cell: (info) => ROLE_LABELS[info.getValue()] }),
  helper.accessor('state', {
    header: 'State',
    cell: (info) =>
      info.getValue() === 'active' ? (
        <Badge colorPalette="success">Active</Badge>
      ) : (
        <Badge colorPalette="warning">Invitation pending</Badge>
      ),
  }),
  helper.accessor('grantedAt', {
    header: 'Since',
    cell: ({ row }) => (
      <Stack gap="0">
        <time dateTime={row.original.grantedAt}>{formatInstant(row.original.grantedAt)}</time>
        {row.original.grantedBy && (
          <Text fontSize="sm" color="fg.muted">
            by {row.original.grantedBy}
          </Text>
        )}
      </Stack>
    ),
  }),
  helper.display({
    id: 'actions',
    header: () => <VisuallyHidden>Actions</VisuallyHidden>,
    cell: ({ row }) => <RemoveRole holder={row.original} />,
  }),
]);

interface GrantForm {
  email: string;
  role: CallRoleName;
}

function GrantRoleForm({ code }: { code: string }) {
  const grant = useGrantCallRole(code);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<GrantForm>({ defaultValues: { email: '', role: 'referee' } });
  const onSubmit = handleSubmit((values) =>
    grant.mutate(values, {
      onSuccess: (holder) => {
        reset({ email: '', role: values.role });
        toaster.create({
          type: 'success',
          title:
            holder.state === 'active'
              ? `${holder.email} is now ${values.role} of ${code}`
              : `Invitation sent to ${holder.email}`,
          description:
            holder.state === 'pending'
              ? 'The role waits until the address registers and confirms it.'
              : undefined,
        });
      },
      onError: (error) => setServerErrors(error, setError, ['email', 'role']),
    }),
  );
  return (
    <Stack asChild gap="3">
      <form onSubmit={onSubmit} noValidate aria-label="Invite by e-mail">
        <HStack align="end" gap="3" wrap="wrap">
          <FormField label="E-mail address" error={errors.email} required flex="1" minW="16rem">
            <Input
              type="email"
              autoComplete="off"
              {...register('email', { required: 'Give the e-mail address to invite' })}
            />
          </FormField>
          <FormField label="Role" error={errors.role} w="12rem">
            <NativeSelect.Root>
              <NativeSelect.Field {...register('role')}>
                <option value="referee">Referee</option>
                <option value="chair">Chair</option>
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </FormField>
          <Button type="submit" loading={grant.isPending}>
            <UserPlus aria-hidden /> Invite
          </Button>
        </HStack>
        <FormError error={errors.root?.server} />
      </form>
    </Stack>
  );
}

/** Staff: who chairs and referees the call; invite by e-mail, remove with confirmation. */
export function RolesPanel({ call }: { call: Call }) {
  const query = useCallRoles(call.code);
  // Stable rows: a new array each render would rebuild the table's row model every time.
  const rows = useMemo(
    () => query.data?.map((r) => ({ ...r, callCode: call.code })) ?? EMPTY,
    [query.data, call.code],
  );
  const table = useTable({ features, columns, data: rows });
  return (
    <Card.Root as="section" aria-labelledby="roles-heading" variant="outline">
      <Card.Body>
        <Stack gap="4">
          <Stack gap="1">
            <Heading as="h2" size="md" id="roles-heading">
              Chair and referees
            </Heading>
            <Text color="fg.muted" fontSize="sm">
              An invitation e-mail goes out at once. An address without an account is asked to
              register; the role waits for it.
            </Text>
          </Stack>
          {query.isPending ? (
            <BlockLoader label="Loading the call's roles" />
          ) : query.isError ? (
            <QueryError error={query.error} onRetry={() => void query.refetch()} what="the roles" />
          ) : rows.length === 0 ? (
            <Text color="fg.muted">Nobody holds a role in this call yet.</Text>
          ) : (
            <Table.ScrollArea borderWidth="1px" rounded="md">
              <Table.Root size="sm">
                <Table.Caption srOnly>Roles in call {call.code}</Table.Caption>
                <Table.Header>
                  {table.getHeaderGroups().map((group) => (
                    <Table.Row key={group.id}>
                      {group.headers.map((header) => (
                        <Table.ColumnHeader key={header.id}>
                          <table.FlexRender header={header} />
                        </Table.ColumnHeader>
                      ))}
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
                    </Table.Row>
                  ))}
                </Table.Body>
              </Table.Root>
            </Table.ScrollArea>
          )}
          {call.status !== 'archived' && <GrantRoleForm code={call.code} />}
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

const EMPTY: Row[] = [];
