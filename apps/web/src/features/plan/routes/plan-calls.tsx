import { Link, Table } from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { CalendarRange } from 'lucide-react';
import { Link as RouterLink } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { planHref } from '@/lib/paths';
import { defineRoute } from '@/lib/route-module';
import { formatInstant } from '@/lib/time';
import { type PlanCallSummary, planCallsQueryOptions } from '../api';
import { usePlanCalls } from '../hooks';
import { hoursText } from '../labels';

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, PlanCallSummary>();
const columns = helper.columns([
  helper.accessor('code', {
    header: 'Call',
    cell: (info) => (
      <Link asChild fontFamily="mono">
        <RouterLink to={planHref(info.getValue())}>{info.getValue()}</RouterLink>
      </Link>
    ),
  }),
  helper.accessor('title', { header: 'Title' }),
  helper.display({
    id: 'plan',
    header: 'Plan',
    cell: ({ row }) =>
      row.original.generatedAt ? (
        <StatusIndicator tone="success">
          Generated {formatInstant(row.original.generatedAt)}
        </StatusIndicator>
      ) : (
        <StatusIndicator tone="warning">Not generated yet</StatusIndicator>
      ),
  }),
  helper.display({
    id: 'hours',
    header: 'Planned / granted',
    cell: ({ row }) =>
      `${hoursText(row.original.plannedHours)} / ${hoursText(row.original.grantedHours)}`,
  }),
  helper.display({
    id: 'runs',
    header: 'Runs observed',
    cell: ({ row }) => `${row.original.observedRuns} of ${row.original.runs}`,
  }),
]);

/** Staff: the published calls whose grants are to be planned, with the state of each plan. */
function PlanCallsPage() {
  const query = usePlanCalls();
  const table = useTable({ features, columns, data: query.data ?? [] });
  return (
    <>
      <PageHeader
        title="Observing plans"
        description="Published calls: build each plan from its grants, then record what was observed."
      />
      {query.isPending ? (
        <BlockLoader label="Loading the plans" />
      ) : query.isError ? (
        <LoadError error={query.error} what="the plans" onRetry={() => void query.refetch()} />
      ) : query.data.length === 0 ? (
        <EmptyState
          icon={CalendarRange}
          title="No published call yet"
          description="A call's grants can be planned once its outcomes are published."
        />
      ) : (
        <Table.ScrollArea
          borderWidth="1px"
          rounded="md"
          tabIndex={0}
          aria-label="Published calls, scrollable"
        >
          <Table.Root size="sm">
            <Table.Caption srOnly>Published calls and their plans</Table.Caption>
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
    </>
  );
}

export const route = defineRoute({
  Component: PlanCallsPage,
  loader: (queryClient) => () => {
    void queryClient.prefetchQuery(planCallsQueryOptions());
    return null;
  },
});
