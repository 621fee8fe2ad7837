import { Link, Table } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Link as RouterLink } from 'react-router-dom';
import { callHref } from '@/lib/paths';
import { formatInstant } from '@/lib/time';
import type { Call } from '../api';
import { CallStatusBadge } from './call-status-badge';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, Call>();
const columns = helper.columns([
  helper.accessor('code', {
    header: 'Call',
    cell: (info) => (
      <Link asChild fontFamily="mono">
        <RouterLink to={callHref(info.getValue())}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  helper.accessor('title', { header: 'Title' }),
  helper.accessor('deadlineAt', {
    header: 'Deadline',
    cell: (info) => <time dateTime={info.getValue()}>{formatInstant(info.getValue())}</time>,
  }),
  helper.display({
    id: 'status',
    header: 'Status',
    cell: ({ row }) => <CallStatusBadge call={row.original} />,
  }),
]);

/** Calls past their deadline (or any list of calls) as a compact table. */
export function CallsTable({ calls, caption }: { calls: Call[]; caption: string }) {
  const table = useTable({ features, columns, data: calls });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>{caption}</Table.Caption>
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
  );
}
