import { Table } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import type { CallCapacity } from '../api';

const number = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });
const metres = (m: number) =>
  m >= 1000 ? `${number.format(m / 1000)} km` : `${number.format(m)} m`;

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, CallCapacity>();
const columns = helper.columns([
  helper.accessor('configurationName', { header: 'Configuration' }),
  helper.accessor('shortestBaselineM', {
    header: 'Shortest baseline',
    cell: (info) => metres(info.getValue()),
  }),
  helper.accessor('longestBaselineM', {
    header: 'Longest baseline',
    cell: (info) => metres(info.getValue()),
  }),
  helper.accessor('hours', {
    header: 'Hours on offer',
    cell: (info) => `${number.format(info.getValue())} h`,
  }),
]);

const NUMERIC = new Set(['shortestBaselineM', 'longestBaselineM', 'hours']);

/** Hours the call offers in each configuration of the array, with the total. */
export function CapacityTable({
  capacity,
  totalHours,
}: {
  capacity: CallCapacity[];
  totalHours: number;
}) {
  const table = useTable({ features, columns, data: capacity });
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Hours on offer per configuration</Table.Caption>
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id}>
              {group.headers.map((header) => (
                <Table.ColumnHeader
                  key={header.id}
                  textAlign={NUMERIC.has(header.column.id) ? 'end' : 'start'}
                >
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
                <Table.Cell key={cell.id} textAlign={NUMERIC.has(cell.column.id) ? 'end' : 'start'}>
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
            </Table.Row>
          ))}
        </Table.Body>
        <Table.Footer>
          <Table.Row>
            <Table.Cell colSpan={3} fontWeight="semibold">
              Total
            </Table.Cell>
            <Table.Cell textAlign="end" fontWeight="semibold">
              {number.format(totalHours)} h
            </Table.Cell>
          </Table.Row>
        </Table.Footer>
      </Table.Root>
    </Table.ScrollArea>
  );
}
