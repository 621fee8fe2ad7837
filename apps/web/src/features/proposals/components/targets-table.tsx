import { Button, HStack, Table, Text } from '@chakra-ui/react';
import { formatDeclination, formatRightAscension } from '@skyhours/calc';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Pencil, Trash2 } from 'lucide-react';
import type { Target } from '../api';
import { formatNumber } from '../format';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, Target>();

function lineText(target: Target): string {
  const { line } = target;
  if (!line) return '—';
  const shift =
    line.redshift !== undefined && line.redshift !== null
      ? `z = ${formatNumber(line.redshift, 4)}`
      : `${formatNumber(line.velocityKmS ?? 0, 5)} km/s (${line.convention ?? 'radio'})`;
  return `${formatNumber(line.restGHz, 7)} GHz, ${shift}`;
}

const columns = helper.columns([
  helper.accessor('name', {
    header: 'Name',
    cell: (info) => <Text fontWeight="medium">{info.getValue()}</Text>,
  }),
  helper.accessor('raDeg', {
    header: 'RA (ICRS)',
    cell: (info) => formatRightAscension(info.getValue(), 2),
  }),
  helper.accessor('decDeg', {
    header: 'Dec (ICRS)',
    cell: (info) => formatDeclination(info.getValue(), 1),
  }),
  helper.accessor('extentArcsec', {
    header: 'Extent',
    cell: (info) => `${formatNumber(info.getValue())}″`,
  }),
  helper.accessor('fluxDensityMJy', {
    header: 'Flux density',
    cell: (info) => (info.getValue() === null ? '—' : `${formatNumber(info.getValue())} mJy`),
  }),
  helper.display({ id: 'line', header: 'Line', cell: ({ row }) => lineText(row.original) }),
]);

export function TargetsTable({
  targets,
  onEdit,
  onDelete,
}: {
  targets: Target[];
  onEdit?: (target: Target) => void;
  onDelete?: (target: Target) => void;
}) {
  const table = useTable({ features, columns, data: targets, getRowId: (target) => target.id });
  const actions = onEdit !== undefined || onDelete !== undefined;
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Targets</Table.Caption>
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id}>
              {group.headers.map((header) => (
                <Table.ColumnHeader key={header.id}>
                  <table.FlexRender header={header} />
                </Table.ColumnHeader>
              ))}
              {actions && (
                <Table.ColumnHeader>
                  <Text srOnly>Actions</Text>
                </Table.ColumnHeader>
              )}
            </Table.Row>
          ))}
        </Table.Header>
        <Table.Body>
          {table.getRowModel().rows.map((row) => (
            <Table.Row key={row.id}>
              {row.getAllCells().map((cell) => (
                <Table.Cell key={cell.id} fontVariantNumeric="tabular-nums">
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
              {actions && (
                <Table.Cell textAlign="end">
                  <HStack gap="2" justify="end">
                    {onEdit && (
                      <Button
                        size="xs"
                        variant="outline"
                        onClick={() => onEdit(row.original)}
                        aria-label={`Change ${row.original.name}`}
                      >
                        <Pencil aria-hidden /> Change
                      </Button>
                    )}
                    {onDelete && (
                      <Button
                        size="xs"
                        variant="outline"
                        colorPalette="blocker"
                        onClick={() => onDelete(row.original)}
                        aria-label={`Delete ${row.original.name}`}
                      >
                        <Trash2 aria-hidden /> Delete
                      </Button>
                    )}
                  </HStack>
                </Table.Cell>
              )}
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}
