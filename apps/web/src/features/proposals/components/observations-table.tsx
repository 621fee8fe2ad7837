import { Button, HStack, Stack, Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Pencil, Trash2 } from 'lucide-react';
import type { ReactNode } from 'react';
import { StatusIndicator } from '@/components/ui/status-indicator';
import type { Observation, ObservatorySetup, Target } from '../api';
import { formatHours, formatNumber } from '../format';
import { plural } from '../labels';

/** A stored observation with the names of what it refers to. */
export interface ObservationRow {
  observation: Observation;
  targetName: string;
  bandName: string;
  configurationName: string;
}

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ObservationRow>();

function RmsCell({ observation }: { observation: Observation }) {
  const { rmsMicroJy } = observation.result;
  const goal = observation.rmsGoalMicroJy;
  if (rmsMicroJy === null) return <Text color="fg.muted">—</Text>;
  const reached = goal === null || rmsMicroJy <= goal * 1.1;
  return (
    <Stack gap="0">
      <Text>{formatNumber(rmsMicroJy)} µJy</Text>
      {goal !== null && (
        <Text fontSize="xs" color={reached ? 'fg.muted' : 'warning.fg'}>
          goal {formatNumber(goal)} µJy{reached ? '' : ' — not reached'}
        </Text>
      )}
    </Stack>
  );
}

function CheckCell({ observation }: { observation: Observation }) {
  const count = (level: string) => observation.checks.filter((c) => c.level === level).length;
  const [blockers, warnings, notes] = [count('blocker'), count('warning'), count('note')];
  if (blockers + warnings + notes === 0)
    return <StatusIndicator tone="success">None</StatusIndicator>;
  return (
    <Stack gap="0.5">
      {blockers > 0 && (
        <StatusIndicator tone="blocker">{plural(blockers, 'blocker')}</StatusIndicator>
      )}
      {warnings > 0 && (
        <StatusIndicator tone="warning">{plural(warnings, 'warning')}</StatusIndicator>
      )}
      {notes > 0 && <StatusIndicator tone="note">{plural(notes, 'note')}</StatusIndicator>}
    </Stack>
  );
}

const columns = helper.columns([
  helper.accessor('targetName', {
    header: 'Target',
    cell: (info) => <Text fontWeight="medium">{info.getValue()}</Text>,
  }),
  helper.display({
    id: 'setup',
    header: 'Band · configuration',
    cell: ({ row }) => `${row.original.bandName} · ${row.original.configurationName}`,
  }),
  helper.display({
    id: 'frequency',
    header: 'Sky frequency',
    cell: ({ row }) => `${formatNumber(row.original.observation.result.skyFrequencyGHz, 6)} GHz`,
  }),
  helper.display({
    id: 'resolution',
    header: 'Resolution',
    cell: ({ row }) => `${formatNumber(row.original.observation.result.resolutionArcsec)}″`,
  }),
  helper.display({
    id: 'rms',
    header: 'Rms reached',
    cell: ({ row }) => <RmsCell observation={row.original.observation} />,
  }),
  helper.display({
    id: 'pointings',
    header: 'Pointings',
    cell: ({ row }) => row.original.observation.result.pointings,
  }),
  helper.display({
    id: 'hours',
    header: 'Hours asked',
    cell: ({ row }) => formatHours(row.original.observation.hoursAsked),
  }),
  helper.display({
    id: 'checks',
    header: 'Checks',
    cell: ({ row }) => <CheckCell observation={row.original.observation} />,
  }),
]);

export function observationRows(
  observations: Observation[],
  targets: Target[],
  observatory: ObservatorySetup | undefined,
): ObservationRow[] {
  return observations.map((observation) => ({
    observation,
    targetName: targets.find((t) => t.id === observation.targetId)?.name ?? 'a removed target',
    bandName: observatory?.bands.find((b) => b.id === observation.bandId)?.name ?? '…',
    configurationName:
      observatory?.configurations.find((c) => c.id === observation.configurationId)?.name ?? '…',
  }));
}

/** The saved observations with the server's numbers; the actions only for those who may edit. */
export function ObservationsTable({
  rows,
  onEdit,
  onDelete,
  footer,
}: {
  rows: ObservationRow[];
  onEdit?: (observation: Observation) => void;
  onDelete?: (row: ObservationRow) => void;
  footer?: ReactNode;
}) {
  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: (row) => row.observation.id,
  });
  const actions = onEdit !== undefined || onDelete !== undefined;
  return (
    <Table.ScrollArea borderWidth="1px" rounded="md">
      <Table.Root size="sm">
        <Table.Caption srOnly>Observations</Table.Caption>
        <Table.Header>
          {table.getHeaderGroups().map((group) => (
            <Table.Row key={group.id}>
              {group.headers.map((header) => (
                <Table.ColumnHeader key={header.id}>
                  <table.FlexRender header={header} />
                </Table.ColumnHeader>
              ))}
              {actions && (
                <Table.ColumnHeader textAlign="end">
                  <Text srOnly>Actions</Text>
                </Table.ColumnHeader>
              )}
            </Table.Row>
          ))}
        </Table.Header>
        <Table.Body>
          {table.getRowModel().rows.map((row) => (
            <Table.Row key={row.id} data-observation={row.original.observation.id}>
              {row.getAllCells().map((cell) => (
                <Table.Cell key={cell.id} verticalAlign="top" fontVariantNumeric="tabular-nums">
                  <table.FlexRender cell={cell} />
                </Table.Cell>
              ))}
              {actions && (
                <Table.Cell textAlign="end" verticalAlign="top">
                  <HStack gap="2" justify="end">
                    {onEdit && (
                      <Button
                        size="xs"
                        variant="outline"
                        onClick={() => onEdit(row.original.observation)}
                        aria-label={`Change the observation of ${row.original.targetName}`}
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
                        aria-label={`Delete the observation of ${row.original.targetName}`}
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
        {footer && (
          <Table.Footer>
            <Table.Row>
              <Table.Cell colSpan={columns.length + (actions ? 1 : 0)}>{footer}</Table.Cell>
            </Table.Row>
          </Table.Footer>
        )}
      </Table.Root>
    </Table.ScrollArea>
  );
}
