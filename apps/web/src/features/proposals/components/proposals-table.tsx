import { Link, Stack, Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Link as RouterLink } from 'react-router-dom';
import { callHref, proposalHref } from '@/lib/paths';
import { formatCountdown, formatLocalAndUtc } from '@/lib/time';
import type { ProposalSummary } from '../api';
import { formatHours } from '../format';
import { ROLE_LABELS } from '../labels';
import { CheckCounts, ProposalStatusIndicator } from './proposal-status';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ProposalSummary>();

/** A deadline as a countdown, with both readings of the moment on hover and for screen readers. */
function Deadline({ at, now, open }: { at: string; now: Date; open: boolean }) {
  const { local, utc } = formatLocalAndUtc(at);
  return (
    <Stack gap="0">
      <Text asChild>
        <time dateTime={at} title={`${local} · ${utc}`}>
          {open ? formatCountdown(at, now) : local}
        </time>
      </Text>
      <Text fontSize="xs" color="fg.muted">
        {open ? local : utc}
      </Text>
    </Stack>
  );
}

const columns = helper.columns([
  helper.accessor('reference', {
    header: 'Reference',
    cell: (info) => (
      <Link asChild fontFamily="mono" fontWeight="medium">
        <RouterLink to={proposalHref(info.getValue())}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  helper.accessor('title', {
    header: 'Title',
    cell: ({ row }) => (
      <Stack gap="0">
        <Text>{row.original.title || 'Untitled'}</Text>
        <Text fontSize="xs" color="fg.muted">
          You are {ROLE_LABELS[row.original.myRole]}
        </Text>
      </Stack>
    ),
  }),
  helper.display({
    id: 'call',
    header: 'Call',
    cell: ({ row }) => (
      <Link asChild fontFamily="mono">
        <RouterLink to={callHref(row.original.call.code)} title={row.original.call.title}>
          {row.original.call.code}
        </RouterLink>
      </Link>
    ),
  }),
  helper.accessor('status', {
    header: 'Status',
    cell: (info) => <ProposalStatusIndicator status={info.getValue()} />,
  }),
  helper.display({
    id: 'deadline',
    header: 'Deadline',
    cell: ({ row, table }) => (
      <Deadline
        at={row.original.call.deadline}
        now={(table.options.meta as { now: Date }).now}
        open={row.original.call.status === 'open'}
      />
    ),
  }),
  helper.accessor('hoursAsked', {
    header: 'Hours asked',
    cell: (info) => <Text fontVariantNumeric="tabular-nums">{formatHours(info.getValue())}</Text>,
  }),
  helper.display({
    id: 'checks',
    header: 'Checks',
    cell: ({ row }) => (
      <CheckCounts blockers={row.original.blockers} warnings={row.original.warnings} />
    ),
  }),
]);

/** The proposer's proposals across calls; the server pages them. */
export function ProposalsTable({ proposals, now }: { proposals: ProposalSummary[]; now: Date }) {
  const table = useTable({
    features,
    columns,
    data: proposals,
    getRowId: (proposal) => proposal.reference,
    meta: { now },
  });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Your proposals</Table.Caption>
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
                <Table.Cell key={cell.id} verticalAlign="top">
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
