import { Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import type { PoolReferee } from '../api';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, PoolReferee>();

const columns = helper.columns([
  helper.accessor('name', {
    header: 'Referee',
    cell: ({ row }) => (
      <>
        <Text>{row.original.name}</Text>
        <Text fontSize="xs" color="fg.muted">
          {row.original.affiliation}
        </Text>
      </>
    ),
  }),
  helper.accessor('scienceCategories', {
    header: 'Categories',
    cell: (info) => <Text>{info.getValue().join(', ') || 'Any'}</Text>,
  }),
  helper.accessor('load', {
    header: 'Assigned',
    cell: (info) => <Text fontVariantNumeric="tabular-nums">{info.getValue()}</Text>,
  }),
  helper.accessor('submitted', {
    header: 'Submitted',
    cell: (info) => <Text fontVariantNumeric="tabular-nums">{info.getValue()}</Text>,
  }),
  helper.accessor('conflicts', {
    header: 'Conflicts',
    cell: (info) =>
      info.getValue().length === 0 ? (
        <Text color="fg.muted">None</Text>
      ) : (
        info.getValue().map((c) => (
          <Text key={c.proposalId} fontSize="sm">
            <Text as="span" fontFamily="mono">
              {c.reference}
            </Text>{' '}
            — {c.reason}
          </Text>
        ))
      ),
  }),
]);

/** The call's referee pool with each one's load and conflicts. */
export function PoolTable({ referees }: { referees: PoolReferee[] }) {
  const table = useTable({ features, columns, data: referees, getRowId: (r) => r.userId });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Referee pool</Table.Caption>
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
