import { Link, Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Link as RouterLink } from 'react-router-dom';
import { reviewHref } from '@/lib/paths';
import type { ReviewListItem } from '../api';
import { DueDate } from './due-date';
import { ReviewStatusIndicator } from './review-status';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ReviewListItem>();

const columns = helper.columns([
  helper.accessor('reference', {
    header: 'Proposal',
    cell: ({ row }) => (
      <Link asChild fontFamily="mono" fontWeight="medium">
        <RouterLink to={reviewHref(row.original.id)}>{row.original.reference}</RouterLink>
      </Link>
    ),
  }),
  helper.accessor('title', {
    header: 'Title',
    cell: ({ row }) => (
      <>
        <Text>{row.original.title || 'Untitled'}</Text>
        <Text fontSize="xs" color="fg.muted">
          {row.original.scienceCategory}
        </Text>
      </>
    ),
  }),
  helper.display({
    id: 'call',
    header: 'Call',
    cell: ({ row }) => (
      <Text fontFamily="mono" title={row.original.call.title}>
        {row.original.call.code}
      </Text>
    ),
  }),
  helper.accessor('status', {
    header: 'Status',
    cell: (info) => <ReviewStatusIndicator status={info.getValue()} />,
  }),
  helper.display({
    id: 'score',
    header: 'Score',
    cell: ({ row }) => (
      <Text fontVariantNumeric="tabular-nums">
        {row.original.score === null
          ? '—'
          : `${row.original.score} of ${row.original.call.scoreMin}–${row.original.call.scoreMax}`}
      </Text>
    ),
  }),
  helper.display({
    id: 'due',
    header: 'Due',
    cell: ({ row, table }) => (
      <DueDate at={row.original.call.reviewDueAt} now={(table.options.meta as { now: Date }).now} />
    ),
  }),
]);

/** The referee's own assignments, across calls. */
export function AssignmentsTable({ items, now }: { items: ReviewListItem[]; now: Date }) {
  const table = useTable({ features, columns, data: items, getRowId: (r) => r.id, meta: { now } });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Your assignments</Table.Caption>
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
