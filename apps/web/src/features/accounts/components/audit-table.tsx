import { Code, Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { formatInstant } from '@/lib/time';
import type { AuditEvent } from '../api';
import { ACTION_LABELS } from '../labels';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, AuditEvent>();

const detailsText = (details: Record<string, unknown>) =>
  Object.entries(details)
    .map(
      ([key, value]) => `${key}: ${Array.isArray(value) ? value.join(', ') || '—' : String(value)}`,
    )
    .join('; ');

const columns = helper.columns([
  helper.accessor('at', {
    header: 'When',
    cell: (info) => <time dateTime={info.getValue()}>{formatInstant(info.getValue())}</time>,
  }),
  helper.accessor('actor', {
    header: 'Who',
    cell: (info) => {
      const actor = info.getValue();
      return actor ? (
        <Text title={actor.email}>{actor.name}</Text>
      ) : (
        <Text color="fg.muted">nobody signed in</Text>
      );
    },
  }),
  helper.accessor('action', {
    header: 'What',
    cell: (info) => ACTION_LABELS[info.getValue()] ?? info.getValue(),
  }),
  helper.accessor('subject', {
    header: 'About',
    cell: (info) => {
      const subject = info.getValue();
      return subject ? <Text title={subject.email}>{subject.name}</Text> : null;
    },
  }),
  helper.accessor('details', {
    header: 'Details',
    cell: (info) => {
      const text = detailsText(info.getValue());
      return text ? <Code fontSize="xs">{text}</Code> : null;
    },
  }),
  helper.accessor('ip', {
    header: 'From',
    cell: (info) => <Code fontSize="xs">{info.getValue() ?? '—'}</Code>,
  }),
]);

/** The audit log, newest first: who did what, when and from where. */
export function AuditTable({ events }: { events: AuditEvent[] }) {
  const table = useTable({ features, columns, data: events, getRowId: (event) => event.id });
  return (
    // Focusable so keyboard users can scroll a wide table (axe: scrollable-region-focusable).
    <Table.ScrollArea borderWidth="1px" rounded="md" tabIndex={0}>
      <Table.Root size="sm">
        <Table.Caption srOnly>Audit log</Table.Caption>
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
