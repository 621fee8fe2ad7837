import { Button, HStack, Stack, Table, Text } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { ListPager } from '@/components/ui/list-pager';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { toaster } from '@/components/ui/toaster';
import { viewerTimeZone } from '@/lib/time';
import type { PlanRun } from '../api';
import { useDeleteRun, useSplitRun, useUpdateRun } from '../hooks';
import {
  hoursText,
  LOST_REASON_LABELS,
  lstText,
  RUN_STATUS_LABELS,
  TIER_LABELS,
  zonedText,
} from '../labels';
import { RecordRunDialog } from './record-run-dialog';

const PAGE_SIZE = 25;
const FIVE_MINUTES = 300_000;

interface RunActions {
  onLock: (run: PlanRun) => void;
  onRecord: (run: PlanRun) => void;
  onSplit: (run: PlanRun) => void;
  onDelete: (run: PlanRun) => void;
}

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, PlanRun>();

function makeColumns(siteZone: string, viewerZone: string, actions: RunActions) {
  return helper.columns([
    helper.display({
      id: 'proposal',
      header: 'Proposal',
      cell: ({ row: { original: r } }) => (
        <Stack gap="0">
          <Text fontFamily="mono">{r.proposal.reference}</Text>
          <Text fontSize="xs" color="fg.muted">
            {r.target.name} · obs. {r.observation.position} · {r.tier ? TIER_LABELS[r.tier] : '—'}
          </Text>
        </Stack>
      ),
    }),
    helper.display({
      id: 'site',
      header: `Site (${siteZone})`,
      cell: ({ row: { original: r } }) => (
        <Text fontSize="sm">
          {zonedText(r.startsAt, siteZone)} – {zonedText(r.endsAt, siteZone)}
        </Text>
      ),
    }),
    helper.display({
      id: 'viewer',
      header: `Yours (${viewerZone})`,
      cell: ({ row: { original: r } }) => (
        <Text fontSize="sm">
          {zonedText(r.startsAt, viewerZone)} – {zonedText(r.endsAt, viewerZone)}
        </Text>
      ),
    }),
    helper.display({
      id: 'lst',
      header: 'LST',
      cell: ({ row: { original: r } }) => (
        <Text fontFamily="mono" fontSize="sm">
          {lstText(r.lstStartHours)}–{lstText(r.lstEndHours)}
        </Text>
      ),
    }),
    helper.accessor('hours', { header: 'Hours', cell: (info) => hoursText(info.getValue()) }),
    helper.display({
      id: 'status',
      header: 'Status',
      cell: ({ row: { original: r } }) => (
        <Stack gap="0">
          <StatusIndicator
            tone={r.status === 'observed' ? 'success' : r.status === 'lost' ? 'blocker' : 'note'}
          >
            {RUN_STATUS_LABELS[r.status]}
            {r.status === 'observed' && r.hoursObtained !== null
              ? `, ${hoursText(r.hoursObtained)}`
              : ''}
            {r.status === 'lost' && r.lostReason ? ` to ${LOST_REASON_LABELS[r.lostReason]}` : ''}
          </StatusIndicator>
          {r.locked && (
            <Text fontSize="xs" color="fg.muted">
              Locked
            </Text>
          )}
        </Stack>
      ),
    }),
    helper.display({
      id: 'actions',
      header: 'Actions',
      cell: ({ row: { original: r } }) => {
        const name = `the run of ${r.proposal.reference} at ${zonedText(r.startsAt, siteZone)}`;
        return (
          <HStack gap="1" wrap="wrap">
            <Button
              size="xs"
              variant="outline"
              onClick={() => actions.onLock(r)}
              aria-label={`${r.locked ? 'Unlock' : 'Lock'} ${name}`}
            >
              {r.locked ? 'Unlock' : 'Lock'}
            </Button>
            <Button
              size="xs"
              variant="outline"
              onClick={() => actions.onRecord(r)}
              aria-label={`Record ${name}`}
            >
              Record
            </Button>
            <Button
              size="xs"
              variant="outline"
              disabled={r.status !== 'planned' || r.hours < 10 / 60}
              onClick={() => actions.onSplit(r)}
              aria-label={`Split ${name}`}
            >
              Split
            </Button>
            <Button
              size="xs"
              variant="outline"
              colorPalette="blocker"
              disabled={r.status !== 'planned'}
              onClick={() => actions.onDelete(r)}
              aria-label={`Delete ${name}`}
            >
              Delete
            </Button>
          </HStack>
        );
      },
    }),
  ]);
}

/** The middle of a run on the 5-minute grid, where Split cuts it. */
export function splitPoint(run: Pick<PlanRun, 'startsAt' | 'endsAt'>): string {
  const s = Date.parse(run.startsAt);
  const e = Date.parse(run.endsAt);
  const mid = s + Math.round((e - s) / 2 / FIVE_MINUTES) * FIVE_MINUTES;
  return new Date(Math.min(Math.max(mid, s + FIVE_MINUTES), e - FIVE_MINUTES)).toISOString();
}

/** Every run of the plan, a page at a time, with staff's actions on each. */
export function RunsTable({
  code,
  runs,
  siteZone,
}: {
  code: string;
  runs: PlanRun[];
  siteZone: string;
}) {
  const [page, setPage] = useState(1);
  const [recording, setRecording] = useState<PlanRun | null>(null);
  const [splitting, setSplitting] = useState<PlanRun | null>(null);
  const [deleting, setDeleting] = useState<PlanRun | null>(null);
  const update = useUpdateRun(code);
  const split = useSplitRun(code);
  const remove = useDeleteRun(code);
  const fail = (error: Error) => toaster.create({ type: 'error', title: error.message });
  const columns = makeColumns(siteZone, viewerTimeZone(), {
    onLock: (r) =>
      update.mutate(
        { id: r.id, change: { version: r.version, locked: !r.locked } },
        { onError: fail },
      ),
    onRecord: setRecording,
    onSplit: setSplitting,
    onDelete: setDeleting,
  });
  const pages = Math.max(1, Math.ceil(runs.length / PAGE_SIZE));
  const current = Math.min(page, pages);
  const data = runs.slice((current - 1) * PAGE_SIZE, current * PAGE_SIZE);
  const table = useTable({ features, columns, data });
  return (
    <>
      <Table.ScrollArea borderWidth="1px" rounded="md" tabIndex={0} aria-label="Runs, scrollable">
        <Table.Root size="sm">
          <Table.Caption srOnly>Runs of the plan</Table.Caption>
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
      <ListPager
        page={current}
        pageSize={PAGE_SIZE}
        total={runs.length}
        onPage={setPage}
        label="Pages of runs"
        noun="runs"
      />
      <RecordRunDialog code={code} run={recording} onClose={() => setRecording(null)} />
      <ConfirmDialog
        open={splitting !== null}
        onOpenChange={(open) => !open && setSplitting(null)}
        title="Split the run?"
        confirmLabel="Split"
        pending={split.isPending}
        error={split.error?.message ?? null}
        onConfirm={() =>
          splitting &&
          split.mutate(
            { id: splitting.id, version: splitting.version, at: splitPoint(splitting) },
            { onSuccess: () => setSplitting(null) },
          )
        }
      >
        {splitting &&
          `The run of ${splitting.proposal.reference} becomes two runs, cut at ${zonedText(splitPoint(splitting), siteZone)}.`}
      </ConfirmDialog>
      <ConfirmDialog
        open={deleting !== null}
        onOpenChange={(open) => !open && setDeleting(null)}
        title="Delete the run?"
        confirmLabel="Delete"
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() =>
          deleting && remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) })
        }
      >
        {deleting &&
          `The run of ${deleting.proposal.reference} from ${zonedText(deleting.startsAt, siteZone)} is removed; generating the plan again may place the time elsewhere.`}
      </ConfirmDialog>
    </>
  );
}
