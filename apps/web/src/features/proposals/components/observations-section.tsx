import { Button, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import { Crosshair, FileSpreadsheet, Plus, Telescope } from 'lucide-react';
import { useState } from 'react';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { BlockLoader } from '@/components/ui/loading';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import {
  deleteObservation,
  deleteTarget,
  type Observation,
  type Proposal,
  type Target,
} from '../api';
import type { FocusRequest } from '../focus';
import { formatHours } from '../format';
import { useObservatory, useProposalWrite } from '../hooks';
import { CsvImport } from './csv-import';
import { ObservationForm } from './observation-form';
import { type ObservationRow, ObservationsTable, observationRows } from './observations-table';
import { TargetForm } from './target-form';
import { TargetsTable } from './targets-table';

type Open =
  | null
  | { kind: 'target'; target?: Target; field?: string; request?: string }
  | { kind: 'csv' }
  | { kind: 'observation'; observation?: Observation; field?: string; request?: string };

type Removal =
  { kind: 'target'; target: Target } | { kind: 'observation'; row: ObservationRow } | null;

function openFor(proposal: Proposal, focus: FocusRequest | undefined): Open {
  if (!focus) return null;
  const observation = proposal.observations.find((o) => o.id === focus.observationId);
  if (observation)
    return {
      kind: 'observation',
      observation,
      field: focus.field ?? 'targetId',
      request: focus.key,
    };
  const target = proposal.targets.find((t) => t.id === focus.targetId);
  if (target) return { kind: 'target', target, field: focus.field ?? 'name', request: focus.key };
  return null;
}

export function ObservationsSection({
  proposal,
  editable,
  focus,
}: {
  proposal: Proposal;
  editable: boolean;
  focus?: FocusRequest;
}) {
  const { reference, targets, observations } = proposal;
  const observatory = useObservatory(proposal.call.observatoryId);
  const [open, setOpen] = useState<Open>(() => (editable ? openFor(proposal, focus) : null));
  const [removal, setRemoval] = useState<Removal>(null);
  const focusKey = focus?.key ?? '';

  // A new request from the Checks list opens the form it points at (adjusted while rendering,
  // as React advises for state that follows a prop).
  const [handled, setHandled] = useState(focusKey);
  if (focusKey !== handled) {
    setHandled(focusKey);
    if (editable && focusKey) setOpen(openFor(proposal, focus));
  }

  const removeTarget = useProposalWrite(reference, (version, target: Target) =>
    deleteTarget(reference, version, target.id),
  );
  const removeObservation = useProposalWrite(reference, (version, observation: Observation) =>
    deleteObservation(reference, version, observation.id),
  );
  const removing = removal?.kind === 'target' ? removeTarget : removeObservation;
  const removalError = (() => {
    const error = removing.error;
    if (!error) return null;
    if (isApiError(error, 409) && error.code === 'TARGET_IN_USE')
      return `${error.message} Delete or change the observations of this target first.`;
    if (isApiError(error, 409) && error.code === 'STALE_VERSION')
      return 'Someone else changed this proposal meanwhile. Close this, check the lists, and try again.';
    return error.message;
  })();

  const confirmRemoval = () => {
    if (removal?.kind === 'target') {
      removeTarget.mutate(removal.target, {
        onSuccess: () => {
          toaster.create({ type: 'success', title: `${removal.target.name} deleted` });
          setRemoval(null);
        },
      });
    } else if (removal?.kind === 'observation') {
      removeObservation.mutate(removal.row.observation, {
        onSuccess: () => {
          toaster.create({
            type: 'success',
            title: `Observation of ${removal.row.targetName} deleted`,
          });
          setRemoval(null);
        },
      });
    }
  };

  const close = () => setOpen(null);
  const rows = observationRows(observations, targets, observatory.data);
  const totalHours = observations.reduce((sum, o) => sum + o.hoursAsked, 0);

  return (
    <Stack gap="8">
      <Stack as="section" aria-labelledby="targets-heading" gap="4">
        <HStack justify="space-between" wrap="wrap" gap="3">
          <Heading as="h3" size="md" id="targets-heading">
            Targets
          </Heading>
          {editable && (
            <HStack gap="2" wrap="wrap">
              <Button size="sm" variant="outline" onClick={() => setOpen({ kind: 'target' })}>
                <Plus aria-hidden /> Add a target
              </Button>
              <Button size="sm" variant="outline" onClick={() => setOpen({ kind: 'csv' })}>
                <FileSpreadsheet aria-hidden /> Import from CSV
              </Button>
            </HStack>
          )}
        </HStack>
        {open?.kind === 'target' && (
          <TargetForm
            key={`${open.target?.id ?? 'new'}-${open.request ?? ''}`}
            proposal={proposal}
            target={open.target}
            focusField={open.field}
            onDone={close}
          />
        )}
        {open?.kind === 'csv' && <CsvImport proposal={proposal} onDone={close} />}
        {targets.length === 0 ? (
          open?.kind !== 'target' &&
          open?.kind !== 'csv' && (
            <EmptyState
              icon={Crosshair}
              title="No targets yet"
              description={
                editable
                  ? 'Add the sources to observe one by one, or import a list from a CSV table.'
                  : 'The team has not added any targets.'
              }
            />
          )
        ) : (
          <TargetsTable
            targets={targets}
            onEdit={editable ? (target) => setOpen({ kind: 'target', target }) : undefined}
            onDelete={editable ? (target) => setRemoval({ kind: 'target', target }) : undefined}
          />
        )}
      </Stack>

      <Stack as="section" aria-labelledby="observations-heading" gap="4">
        <HStack justify="space-between" wrap="wrap" gap="3">
          <Heading as="h3" size="md" id="observations-heading">
            Observations
          </Heading>
          {editable && (
            <Button
              size="sm"
              variant="outline"
              onClick={() => setOpen({ kind: 'observation' })}
              disabled={targets.length === 0 || !observatory.data}
              title={targets.length === 0 ? 'Add a target first' : undefined}
            >
              <Plus aria-hidden /> Add an observation
            </Button>
          )}
        </HStack>
        {observatory.isPending && (
          <BlockLoader label="Loading the array's configurations and bands" />
        )}
        {observatory.isError && (
          <LoadError
            error={observatory.error}
            what="the array's configurations and bands"
            onRetry={() => void observatory.refetch()}
          />
        )}
        {open?.kind === 'observation' && observatory.data && (
          <ObservationForm
            key={`${open.observation?.id ?? 'new'}-${open.request ?? ''}`}
            proposal={proposal}
            observatory={observatory.data}
            observation={open.observation}
            focusField={open.field}
            onDone={close}
          />
        )}
        {observations.length === 0 ? (
          open?.kind !== 'observation' && (
            <EmptyState
              icon={Telescope}
              title="No observations yet"
              description={
                editable
                  ? targets.length === 0
                    ? 'Add a target first; then choose its band, configuration and the time it needs.'
                    : 'Choose a target, its band and configuration, and the time it needs; the numbers show as you type.'
                  : 'The team has not added any observations.'
              }
            />
          )
        ) : (
          <ObservationsTable
            rows={rows}
            onEdit={
              editable ? (observation) => setOpen({ kind: 'observation', observation }) : undefined
            }
            onDelete={editable ? (row) => setRemoval({ kind: 'observation', row }) : undefined}
            footer={
              <Text fontWeight="medium" textAlign="end">
                Total asked: {formatHours(totalHours)}
              </Text>
            }
          />
        )}
      </Stack>

      <ConfirmDialog
        open={removal !== null}
        onOpenChange={(isOpen) => {
          if (!isOpen) {
            setRemoval(null);
            removeTarget.reset();
            removeObservation.reset();
          }
        }}
        title={
          removal?.kind === 'target'
            ? `Delete ${removal.target.name}?`
            : `Delete the observation of ${removal?.row.targetName ?? ''}?`
        }
        confirmLabel="Delete"
        tone="danger"
        pending={removing.isPending}
        error={removalError}
        onConfirm={confirmRemoval}
      >
        <Text>
          {removal?.kind === 'target'
            ? 'The target leaves the proposal. A target that an observation still uses cannot be deleted.'
            : 'The observation and its hours leave the proposal.'}
        </Text>
      </ConfirmDialog>
    </Stack>
  );
}
