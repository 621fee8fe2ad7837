import { Alert, Button, Heading, HStack, Link, List, Stack, Table, Text } from '@chakra-ui/react';
import { CalendarRange, Download } from 'lucide-react';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { toaster } from '@/components/ui/toaster';
import { defineRoute } from '@/lib/route-module';
import { formatLocalAndUtc } from '@/lib/time';
import { type Plan, planFileHref, planQueryOptions } from '../api';
import { LstPressure } from '../components/lst-pressure';
import { RunTimeline } from '../components/run-timeline';
import { RunsTable } from '../components/runs-table';
import { PlanSettingsForm } from '../components/settings-form';
import { useGeneratePlan, usePlan } from '../hooks';
import { hoursText, TIER_LABELS, UNPLACED_LABELS } from '../labels';

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <Stack as="section" gap="3" aria-label={title}>
      <Heading as="h2" size="lg">
        {title}
      </Heading>
      {children}
    </Stack>
  );
}

function Totals({ plan }: { plan: Plan }) {
  return (
    <Table.ScrollArea
      borderWidth="1px"
      rounded="md"
      tabIndex={0}
      aria-label="Hours per tier, scrollable"
    >
      <Table.Root size="sm">
        <Table.Caption srOnly>Hours per tier</Table.Caption>
        <Table.Header>
          <Table.Row>
            <Table.ColumnHeader>Tier</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Granted</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Planned</Table.ColumnHeader>
            <Table.ColumnHeader textAlign="end">Observed</Table.ColumnHeader>
          </Table.Row>
        </Table.Header>
        <Table.Body>
          {plan.totals.map((t) => (
            <Table.Row key={t.tier}>
              <Table.Cell>{TIER_LABELS[t.tier]}</Table.Cell>
              <Table.Cell textAlign="end">{hoursText(t.granted)}</Table.Cell>
              <Table.Cell textAlign="end">{hoursText(t.planned)}</Table.Cell>
              <Table.Cell textAlign="end">{hoursText(t.observed)}</Table.Cell>
            </Table.Row>
          ))}
        </Table.Body>
      </Table.Root>
    </Table.ScrollArea>
  );
}

/** Staff: one call's observing plan — settings, generation, the runs and what did not fit. */
function PlanPage() {
  const { code = '' } = useParams();
  const query = usePlan(code);
  const generate = useGeneratePlan(code);
  const [confirming, setConfirming] = useState(false);
  if (query.isPending) return <PageLoader label="Loading the plan" />;
  if (query.isError)
    return <LoadError error={query.error} what="the plan" onRetry={() => void query.refetch()} />;
  const plan = query.data;
  const generated = plan.settings.generatedAt ? formatLocalAndUtc(plan.settings.generatedAt) : null;
  const runGenerate = () =>
    generate.mutate(undefined, {
      onSuccess: (p) => {
        setConfirming(false);
        toaster.create({
          type: 'success',
          title: `Plan generated: ${p.runs.length} runs, ${p.unplaced.length} not placed`,
        });
      },
    });
  return (
    <>
      <PageHeader
        title={`Plan ${plan.call.code}`}
        description={`${plan.call.title} · ${plan.site.name}, site time ${plan.site.timeZone}`}
        actions={
          <>
            <Button
              onClick={() => (plan.runs.length ? setConfirming(true) : runGenerate())}
              loading={generate.isPending && !confirming}
            >
              <CalendarRange aria-hidden /> Generate plan
            </Button>
          </>
        }
      />
      <Stack gap="8">
        {generate.isError && !confirming && (
          <Alert.Root status="error" colorPalette="blocker" role="alert">
            <Alert.Indicator />
            <Alert.Title>{generate.error.message}</Alert.Title>
          </Alert.Root>
        )}
        <Text color="fg.muted">
          {generated
            ? `Last generated ${generated.local} (${generated.utc}).`
            : 'Not generated yet.'}{' '}
          {plan.periods.length > 0 &&
            `Periods: ${plan.periods.map((p) => `${p.configurationName} ${p.start} to ${p.end}`).join('; ')}.`}
        </Text>
        <Section title="Settings">
          <PlanSettingsForm plan={plan} />
        </Section>
        <Section title="Hours per tier">
          <Totals plan={plan} />
        </Section>
        <Section title="Runs per day">
          {plan.runs.length === 0 ? (
            <EmptyState
              icon={CalendarRange}
              title="No runs yet"
              description="Generate the plan to place the granted observations."
            />
          ) : (
            <RunTimeline runs={plan.runs} timeZone={plan.site.timeZone} />
          )}
        </Section>
        <Section title="Not placed">
          {plan.unplaced.length === 0 ? (
            <Text color="fg.muted">Everything granted has a place in the plan.</Text>
          ) : (
            <List.Root gap="1" ps="5">
              {plan.unplaced.map((u) => (
                <List.Item key={u.observationId}>
                  <Text as="span" fontFamily="mono">
                    {u.reference}
                  </Text>{' '}
                  {u.targetName} ({TIER_LABELS[u.tier]}): {hoursText(u.hoursUnplaced)} not placed —{' '}
                  {UNPLACED_LABELS[u.reason]}
                </List.Item>
              ))}
            </List.Root>
          )}
        </Section>
        <Section title="Runs">
          {plan.runs.length > 0 && (
            <>
              <HStack gap="4">
                <Link href={planFileHref(plan.call.code, 'plan.ics')}>
                  <Download aria-hidden size={16} /> Calendar (.ics)
                </Link>
                <Link href={planFileHref(plan.call.code, 'runs.csv')}>
                  <Download aria-hidden size={16} /> Runs (.csv)
                </Link>
              </HStack>
              <RunsTable code={plan.call.code} runs={plan.runs} siteZone={plan.site.timeZone} />
            </>
          )}
        </Section>
        <Section title="LST pressure">
          <LstPressure plan={plan} />
        </Section>
      </Stack>
      <ConfirmDialog
        open={confirming}
        onOpenChange={setConfirming}
        title="Generate the plan again?"
        confirmLabel="Generate"
        pending={generate.isPending}
        error={generate.error?.message ?? null}
        onConfirm={runGenerate}
      >
        Planned runs that are not locked are replaced. Locked runs and recorded runs stay as they
        are.
      </ConfirmDialog>
    </>
  );
}

export const route = defineRoute({
  Component: PlanPage,
  loader:
    (queryClient) =>
    ({ params }) => {
      void queryClient.prefetchQuery(planQueryOptions(params.code ?? ''));
      return null;
    },
});
