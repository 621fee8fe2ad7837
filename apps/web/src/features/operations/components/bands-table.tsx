import {
  Button,
  Checkbox,
  CheckboxGroup,
  HStack,
  IconButton,
  Input,
  InputGroup,
  NativeSelect,
  SimpleGrid,
  Stack,
  Table,
  Text,
  VisuallyHidden,
} from '@chakra-ui/react';
import { createColumnHelper, tableFeatures, useTable } from '@tanstack/react-table';
import { Pencil, Plus, Trash2 } from 'lucide-react';
import { createContext, useContext, useEffect, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError, FormField } from '@/components/ui/form-field';
import { toaster } from '@/components/ui/toaster';
import { setServerErrors } from '@/lib/form-errors';
import { IEEE_LETTERS, type IeeeLetter, type ReceiverBand } from '../api';
import { useRemoveBand, useSaveBand } from '../hooks';
import { numberRule } from './number-rule';
import { RecordDialog } from './record-dialog';

interface BandValues {
  name: string;
  ieeeLetter: IeeeLetter | '';
  minGHz: string;
  maxGHz: string;
  tsysK: string;
  apertureEfficiency: string;
  maxBandwidthMHz: string;
  polarizations: string[];
}

const toValues = (b?: ReceiverBand): BandValues => ({
  name: b?.name ?? '',
  ieeeLetter: b?.ieeeLetter ?? '',
  minGHz: b ? String(b.minGHz) : '',
  maxGHz: b ? String(b.maxGHz) : '',
  tsysK: b ? String(b.tsysK) : '',
  apertureEfficiency: b ? String(b.apertureEfficiency) : '',
  maxBandwidthMHz: b ? String(b.maxBandwidthMHz) : '',
  polarizations: b ? b.polarizations.map(String) : ['1', '2'],
});

const POLARIZATION_LABELS: Record<string, string> = { '1': 'Single', '2': 'Dual' };

function BandDialog({
  observatoryId,
  band,
  open,
  onOpenChange,
}: {
  observatoryId: string;
  band?: ReceiverBand;
  open: boolean;
  onOpenChange: (open: boolean) => void;
}) {
  const save = useSaveBand(observatoryId);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<BandValues>({ defaultValues: toValues(band) });
  useEffect(() => {
    if (open) reset(toValues(band));
  }, [open, band, reset]);
  const submit = handleSubmit(async (values) => {
    try {
      await save.mutateAsync({
        id: band?.id,
        input: {
          name: values.name.trim(),
          ieeeLetter: values.ieeeLetter || null,
          minGHz: Number(values.minGHz),
          maxGHz: Number(values.maxGHz),
          tsysK: Number(values.tsysK),
          apertureEfficiency: Number(values.apertureEfficiency),
          maxBandwidthMHz: Number(values.maxBandwidthMHz),
          polarizations: values.polarizations.map(Number).sort() as (1 | 2)[],
        },
      });
      onOpenChange(false);
      toaster.create({ type: 'success', title: `Band ${values.name} saved` });
    } catch (error) {
      setServerErrors(error, setError, [
        'name',
        'ieeeLetter',
        'minGHz',
        'maxGHz',
        'tsysK',
        'apertureEfficiency',
        'maxBandwidthMHz',
        'polarizations',
      ]);
    }
  });
  return (
    <RecordDialog
      open={open}
      onOpenChange={onOpenChange}
      title={band ? `Edit ${band.name}` : 'Add a receiver band'}
      onSubmit={submit}
      pending={save.isPending}
    >
      <SimpleGrid columns={2} gap="4">
        <FormField label="Name" error={errors.name} required>
          <Input {...register('name', { required: 'Give the band a name' })} />
        </FormField>
        <FormField label="IEEE letter" error={errors.ieeeLetter} helperText="Where one applies">
          <NativeSelect.Root>
            <NativeSelect.Field {...register('ieeeLetter')}>
              <option value="">None</option>
              {IEEE_LETTERS.map((letter) => (
                <option key={letter} value={letter}>
                  {letter}
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
        <FormField label="Lowest frequency" error={errors.minGHz} required>
          <InputGroup endElement="GHz">
            <Input
              inputMode="decimal"
              {...register('minGHz', numberRule('lowest frequency', { min: 0.001, max: 2000 }))}
            />
          </InputGroup>
        </FormField>
        <FormField label="Highest frequency" error={errors.maxGHz} required>
          <InputGroup endElement="GHz">
            <Input
              inputMode="decimal"
              {...register('maxGHz', numberRule('highest frequency', { min: 0.001, max: 2000 }))}
            />
          </InputGroup>
        </FormField>
        <FormField label="System temperature" error={errors.tsysK} required>
          <InputGroup endElement="K">
            <Input
              inputMode="decimal"
              {...register('tsysK', numberRule('system temperature', { min: 1, max: 10000 }))}
            />
          </InputGroup>
        </FormField>
        <FormField
          label="Aperture efficiency"
          error={errors.apertureEfficiency}
          required
          helperText="Between 0 and 1"
        >
          <Input
            inputMode="decimal"
            {...register(
              'apertureEfficiency',
              numberRule('aperture efficiency', { min: 0.01, max: 1 }),
            )}
          />
        </FormField>
        <FormField label="Widest bandwidth" error={errors.maxBandwidthMHz} required>
          <InputGroup endElement="MHz">
            <Input
              inputMode="decimal"
              {...register(
                'maxBandwidthMHz',
                numberRule('widest bandwidth', { min: 0.001, max: 1e6 }),
              )}
            />
          </InputGroup>
        </FormField>
        <FormField label="Polarisations offered" error={errors.polarizations?.message} required>
          <Controller
            control={control}
            name="polarizations"
            rules={{ validate: (v) => v.length > 0 || 'Offer at least one' }}
            render={({ field }) => (
              <CheckboxGroup value={field.value} onValueChange={field.onChange} name={field.name}>
                <HStack gap="5">
                  {['1', '2'].map((p) => (
                    <Checkbox.Root key={p} value={p}>
                      <Checkbox.HiddenInput onBlur={field.onBlur} />
                      <Checkbox.Control />
                      <Checkbox.Label>{POLARIZATION_LABELS[p]}</Checkbox.Label>
                    </Checkbox.Root>
                  ))}
                </HStack>
              </CheckboxGroup>
            )}
          />
        </FormField>
      </SimpleGrid>
      <FormError error={errors.root?.server} />
    </RecordDialog>
  );
}

const ObservatoryContext = createContext('');

function BandActions({ band }: { band: ReceiverBand }) {
  const observatoryId = useContext(ObservatoryContext);
  const [editing, setEditing] = useState(false);
  const [removing, setRemoving] = useState(false);
  const remove = useRemoveBand(observatoryId);
  return (
    <HStack gap="1" justify="end">
      <IconButton
        aria-label={`Edit ${band.name}`}
        variant="ghost"
        size="sm"
        onClick={() => setEditing(true)}
      >
        <Pencil />
      </IconButton>
      <IconButton
        aria-label={`Remove ${band.name}`}
        variant="ghost"
        size="sm"
        onClick={() => {
          remove.reset();
          setRemoving(true);
        }}
      >
        <Trash2 />
      </IconButton>
      <BandDialog
        observatoryId={observatoryId}
        band={band}
        open={editing}
        onOpenChange={setEditing}
      />
      <ConfirmDialog
        open={removing}
        onOpenChange={setRemoving}
        tone="danger"
        title={`Remove ${band.name}?`}
        confirmLabel="Remove"
        pending={remove.isPending}
        error={remove.error?.message}
        onConfirm={() =>
          remove.mutate(band.id, {
            onSuccess: () => {
              setRemoving(false);
              toaster.create({ type: 'success', title: `Band ${band.name} removed` });
            },
          })
        }
      >
        <Text>
          The receiver band {band.name} ({band.minGHz}–{band.maxGHz} GHz) is deleted and can no
          longer be chosen for observations.
        </Text>
      </ConfirmDialog>
    </HStack>
  );
}

const number = new Intl.NumberFormat(undefined, { maximumFractionDigits: 3 });
const features = tableFeatures({});
const helper = createColumnHelper<typeof features, ReceiverBand>();
const columns = helper.columns([
  helper.accessor('name', { header: 'Name' }),
  helper.accessor('ieeeLetter', { header: 'IEEE letter', cell: (i) => i.getValue() ?? '—' }),
  helper.accessor((b) => `${number.format(b.minGHz)}–${number.format(b.maxGHz)} GHz`, {
    id: 'range',
    header: 'Frequencies',
  }),
  helper.accessor('tsysK', { header: 'T_sys', cell: (i) => `${number.format(i.getValue())} K` }),
  helper.accessor('apertureEfficiency', {
    header: 'Aperture efficiency',
    cell: (i) => number.format(i.getValue()),
  }),
  helper.accessor('maxBandwidthMHz', {
    header: 'Widest bandwidth',
    cell: (i) => `${number.format(i.getValue())} MHz`,
  }),
  helper.accessor('polarizations', {
    header: 'Polarisations',
    cell: (i) =>
      i
        .getValue()
        .map((p) => POLARIZATION_LABELS[String(p)])
        .join(', '),
  }),
  helper.display({
    id: 'actions',
    header: () => <VisuallyHidden>Actions</VisuallyHidden>,
    cell: ({ row }) => <BandActions band={row.original} />,
  }),
]);
const NUMERIC = new Set(['range', 'tsysK', 'apertureEfficiency', 'maxBandwidthMHz']);

/** The array's receiver bands, one row each, with add, edit and remove. */
export function BandsTable({
  observatoryId,
  bands,
}: {
  observatoryId: string;
  bands: ReceiverBand[];
}) {
  const [adding, setAdding] = useState(false);
  const table = useTable({ features, columns, data: bands });
  return (
    <ObservatoryContext.Provider value={observatoryId}>
      <Stack gap="3">
        {bands.length === 0 ? (
          <Text color="fg.muted">No receiver bands yet. Observations choose one of these.</Text>
        ) : (
          <Table.ScrollArea borderWidth="1px" rounded="md">
            <Table.Root size="sm">
              <Table.Caption srOnly>Receiver bands</Table.Caption>
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
            <Plus aria-hidden /> Add a receiver band
          </Button>
        </HStack>
        <BandDialog observatoryId={observatoryId} open={adding} onOpenChange={setAdding} />
      </Stack>
    </ObservatoryContext.Provider>
  );
}
