import {
  Button,
  HStack,
  IconButton,
  Input,
  InputGroup,
  SimpleGrid,
  Stack,
  Table,
  Text,
  VisuallyHidden,
} from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Pencil, Plus, Trash2 } from 'lucide-react';
import { createContext, useContext, useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import type { Configuration } from '../api';
import { useRemoveConfiguration, useSaveConfiguration } from '../hooks';
import { numberRule } from './number-rule';
import { RecordDialog } from './record-dialog';

interface ConfigurationValues {
  name: string;
  shortestBaselineM: string;
  longestBaselineM: string;
  inUseFrom: string;
  inUseTo: string;
}

const toValues = (c?: Configuration): ConfigurationValues => ({
  name: c?.name ?? '',
  shortestBaselineM: c ? String(c.shortestBaselineM) : '',
  longestBaselineM: c ? String(c.longestBaselineM) : '',
  inUseFrom: c?.inUseFrom ?? '',
  inUseTo: c?.inUseTo ?? '',
});

/** Add (no `configuration`) or edit one configuration in a dialog. */
function ConfigurationDialog({
  observatoryId,
  configuration,
  open,
  onOpenChange,
}: {
  observatoryId: string;
  configuration?: Configuration;
  open: boolean;
  onOpenChange: (open: boolean) => void;
}) {
  const save = useSaveConfiguration(observatoryId);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<ConfigurationValues>({ defaultValues: toValues(configuration) });
  // Each opening starts from the stored values (or empty, to add one).
  useEffect(() => {
    if (open) reset(toValues(configuration));
  }, [open, configuration, reset]);
  const submit = handleSubmit(async (values) => {
    try {
      await save.mutateAsync({
        id: configuration?.id,
        input: {
          name: values.name.trim(),
          shortestBaselineM: Number(values.shortestBaselineM),
          longestBaselineM: Number(values.longestBaselineM),
          inUseFrom: values.inUseFrom,
          inUseTo: values.inUseTo || null,
        },
      });
      onOpenChange(false);
      toaster.create({ type: 'success', title: `Configuration ${values.name} saved` });
    } catch (error) {
      setServerErrors(error, setError, [
        'name',
        'shortestBaselineM',
        'longestBaselineM',
        'inUseFrom',
        'inUseTo',
      ]);
    }
  });
  return (
    <RecordDialog
      open={open}
      onOpenChange={onOpenChange}
      title={configuration ? `Edit ${configuration.name}` : 'Add a configuration'}
      onSubmit={submit}
      pending={save.isPending}
    >
      <FormField label="Name" error={errors.name} required>
        <Input {...register('name', { required: 'Give the configuration a name' })} />
      </FormField>
      <SimpleGrid columns={2} gap="4">
        <FormField label="Shortest baseline" error={errors.shortestBaselineM} required>
          <InputGroup endElement="m">
            <Input
              inputMode="decimal"
              {...register(
                'shortestBaselineM',
                numberRule('shortest baseline', { min: 0.1, max: 1e7 }),
              )}
            />
          </InputGroup>
        </FormField>
        <FormField label="Longest baseline" error={errors.longestBaselineM} required>
          <InputGroup endElement="m">
            <Input
              inputMode="decimal"
              {...register(
                'longestBaselineM',
                numberRule('longest baseline', { min: 0.1, max: 1e7 }),
              )}
            />
          </InputGroup>
        </FormField>
        <FormField label="In use from" error={errors.inUseFrom} required>
          <Input
            type="date"
            {...register('inUseFrom', { required: 'Give the first day in use' })}
          />
        </FormField>
        <FormField
          label="In use until"
          error={errors.inUseTo}
          helperText="Empty: until further notice"
        >
          <Input type="date" {...register('inUseTo')} />
        </FormField>
      </SimpleGrid>
      <FormError error={errors.root?.server} />
    </RecordDialog>
  );
}

const ObservatoryContext = createContext('');

function ConfigurationActions({ configuration }: { configuration: Configuration }) {
  const observatoryId = useContext(ObservatoryContext);
  const [editing, setEditing] = useState(false);
  const [removing, setRemoving] = useState(false);
  const remove = useRemoveConfiguration(observatoryId);
  return (
    <HStack gap="1" justify="end">
      <IconButton
        aria-label={`Edit ${configuration.name}`}
        variant="ghost"
        size="sm"
        onClick={() => setEditing(true)}
      >
        <Pencil />
      </IconButton>
      <IconButton
        aria-label={`Remove ${configuration.name}`}
        variant="ghost"
        size="sm"
        onClick={() => {
          remove.reset();
          setRemoving(true);
        }}
      >
        <Trash2 />
      </IconButton>
      <ConfigurationDialog
        observatoryId={observatoryId}
        configuration={configuration}
        open={editing}
        onOpenChange={setEditing}
      />
      <ConfirmDialog
        open={removing}
        onOpenChange={setRemoving}
        tone="danger"
        title={`Remove ${configuration.name}?`}
        confirmLabel="Remove"
        pending={remove.isPending}
        error={remove.error?.message}
        onConfirm={() =>
          remove.mutate(configuration.id, {
            onSuccess: () => {
              setRemoving(false);
              toaster.create({
                type: 'success',
                title: `Configuration ${configuration.name} removed`,
              });
            },
          })
        }
      >
        <Text>
          The configuration {configuration.name} ({configuration.shortestBaselineM} m to{' '}
          {configuration.longestBaselineM} m) is deleted. A configuration that a call offers time in
          cannot be removed.
        </Text>
      </ConfirmDialog>
    </HStack>
  );
}

const number = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });
const features = tableFeatures({});
const helper = createColumnHelper<typeof features, Configuration>();
const columns = helper.columns([
  helper.accessor('name', { header: 'Name' }),
  helper.accessor('shortestBaselineM', {
    header: 'Shortest baseline',
    cell: (i) => `${number.format(i.getValue())} m`,
  }),
  helper.accessor('longestBaselineM', {
    header: 'Longest baseline',
    cell: (i) => `${number.format(i.getValue())} m`,
  }),
  helper.accessor('inUseFrom', { header: 'In use from' }),
  helper.accessor('inUseTo', {
    header: 'In use until',
    cell: (i) => i.getValue() ?? 'further notice',
  }),
  helper.display({
    id: 'actions',
    header: () => <VisuallyHidden>Actions</VisuallyHidden>,
    cell: ({ row }) => <ConfigurationActions configuration={row.original} />,
  }),
]);
const NUMERIC = new Set(['shortestBaselineM', 'longestBaselineM']);

/** The array's configurations, one row each, with add, edit and remove. */
export function ConfigurationsTable({
  observatoryId,
  configurations,
}: {
  observatoryId: string;
  configurations: Configuration[];
}) {
  const [adding, setAdding] = useState(false);
  const table = useTable({ features, columns, data: configurations });
  return (
    <ObservatoryContext.Provider value={observatoryId}>
      <Stack gap="3">
        {configurations.length === 0 ? (
          <Text color="fg.muted">
            No configurations yet. A call offers its hours per configuration.
          </Text>
        ) : (
          <Table.ScrollArea borderWidth="1px" rounded="md">
            <Table.Root size="sm">
              <Table.Caption srOnly>Configurations</Table.Caption>
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
                      <Table.Cell
                        key={cell.id}
                        textAlign={NUMERIC.has(cell.column.id) ? 'end' : 'start'}
                      >
                        <table.FlexRender cell={cell} />
                      </Table.Cell>
                    ))}
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
        )}
        <HStack>
          <Button variant="outline" size="sm" onClick={() => setAdding(true)}>
            <Plus aria-hidden /> Add a configuration
          </Button>
        </HStack>
        <ConfigurationDialog observatoryId={observatoryId} open={adding} onOpenChange={setAdding} />
      </Stack>
    </ObservatoryContext.Provider>
  );
}
