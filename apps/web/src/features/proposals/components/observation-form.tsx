import {
  Box,
  Button,
  chakra,
  Grid,
  Heading,
  HStack,
  Input,
  List,
  NativeSelect,
  SimpleGrid,
  Stack,
  Text,
} from '@chakra-ui/react';
import { type ComponentProps, useEffect, useMemo } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { isApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/form-errors';
import {
  addObservation,
  type Observation,
  type ObservationInput,
  type ObservatorySetup,
  type Proposal,
  updateObservation,
} from '../api';
import { formatNumber } from '../format';
import { focusAfterNavigation } from '../focus';
import { useProposalWrite } from '../hooks';
import { apartFromFields, withFieldPaths } from '../issues';
import { plural } from '../labels';
import {
  OBSERVATION_FIELD_LABELS as LABELS,
  type ObservationField,
  type ObservationFormValues,
  observationFieldOf,
  observationFormValues,
  observationInputOf,
  previewObservation,
} from '../observation-preview';
import { FindingsList } from './findings-list';
import { ObservationNumbers } from './observation-numbers';
import { WriteError } from './write-error';

const FIELDS = Object.keys(LABELS) as Path<ObservationFormValues>[];

const dates = (from: string, to: string | null) => (to ? `${from} to ${to}` : `from ${from}`);

function Select({ children, ...props }: ComponentProps<typeof NativeSelect.Field>) {
  return (
    <NativeSelect.Root>
      <NativeSelect.Field {...props}>{children}</NativeSelect.Field>
      <NativeSelect.Indicator />
    </NativeSelect.Root>
  );
}

/**
 * One observation: its setup on the left, the calculator's numbers and checks on the right,
 * recomputed in the browser at every keystroke. Saved, the server runs the same library and its
 * stored numbers are what the table and the submission use.
 */
export function ObservationForm({
  proposal,
  observatory,
  observation,
  onDone,
  focusField,
}: {
  proposal: Proposal;
  observatory: ObservatorySetup;
  observation?: Observation;
  onDone: () => void;
  focusField?: string;
}) {
  const { reference, targets } = proposal;
  const save = useProposalWrite(reference, (version, input: ObservationInput) =>
    observation
      ? updateObservation(reference, version, observation.id, input)
      : addObservation(reference, version, input),
  );
  const {
    register,
    handleSubmit,
    setError,
    setFocus,
    setValue,
    control,
    formState: { errors, isDirty },
  } = useForm<ObservationFormValues>({
    defaultValues: observationFormValues(observation, {
      targetId: targets.length === 1 ? targets[0]?.id : undefined,
    }),
  });
  const values = useWatch({ control }) as ObservationFormValues;
  // The watched object is new each render; its text says whether anything changed.
  const snapshot = JSON.stringify(values);
  const preview = useMemo(
    () =>
      previewObservation(JSON.parse(snapshot) as ObservationFormValues, { observatory, targets }),
    [snapshot, observatory, targets],
  );

  const target = targets.find((t) => t.id === values.targetId);
  const band = observatory.bands.find((b) => b.id === values.bandId);

  useEffect(() => {
    const field = focusField ? observationFieldOf(focusField) : null;
    const name =
      field === 'frequencySource' && values.frequencySource === 'sky'
        ? 'frequencyGHz'
        : (field ?? 'targetId');
    return focusAfterNavigation(() => setFocus(name));
    // Only when asked to focus, not as values change.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focusField, setFocus]);

  // A target without a line cannot give the frequency; a band offers only its polarisations.
  useEffect(() => {
    if (values.frequencySource === 'line' && target && !target.line)
      setValue('frequencySource', 'sky');
  }, [target, values.frequencySource, setValue]);
  useEffect(() => {
    const only = band?.polarizations.length === 1 ? band.polarizations[0] : undefined;
    if (only && values.polarizations !== String(only))
      setValue('polarizations', only === 1 ? '1' : '2');
  }, [band, values.polarizations, setValue]);

  const liveError = (field: ObservationField) =>
    errors[field]?.message ?? (preview.status === 'invalid' ? preview.errors[field] : undefined);

  const onSubmit = handleSubmit((formValues) => {
    if (preview.status === 'invalid') return;
    save.mutate(observationInputOf(formValues), {
      onSuccess: onDone,
      onError: (error) => {
        if (isApiError(error, 400))
          setServerErrors(withFieldPaths(error, observationFieldOf), setError, FIELDS);
      },
    });
  });

  const required = (field: ObservationField) => ({
    validate: (value: string) =>
      value.trim() !== '' || `Give the ${LABELS[field].replace(/ \(.*\)$/, '').toLowerCase()}.`,
  });

  // Saved and untouched: the server's own numbers; once edited: the live preview.
  const showStored = observation !== undefined && !isDirty;
  const overhead = 1 + observatory.overheadFraction;
  let numbers;
  if (showStored) {
    const { result } = observation;
    numbers = (
      <Stack gap="3">
        <ObservationNumbers
          caption="Stored with the observation (the server's numbers)"
          result={result}
          onSourceHours={observation.hoursAsked / (result.pointings * overhead)}
          hoursForGoal={
            result.onSourceHoursForGoal === null
              ? null
              : result.onSourceHoursForGoal * result.pointings * overhead
          }
          rmsGoalMicroJy={observation.rmsGoalMicroJy}
        />
        <FindingsList checks={observation.checks} />
      </Stack>
    );
  } else if (preview.status === 'ready') {
    numbers = (
      <Stack gap="3">
        <ObservationNumbers
          caption="Live preview — not saved yet"
          result={preview.result}
          onSourceHours={preview.onSourceHours}
          hoursForGoal={preview.hoursForGoal}
          rmsGoalMicroJy={preview.input.rmsGoalMicroJy ?? null}
        />
        <FindingsList checks={preview.result.checks} />
      </Stack>
    );
  } else if (preview.status === 'incomplete') {
    numbers = (
      <Text color="fg.muted">
        The numbers appear here as you fill in:{' '}
        {preview.missing
          .map((field) => LABELS[field].replace(/ \(.*\)$/, '').toLowerCase())
          .join(', ')}
        .
      </Text>
    );
  } else {
    numbers = (
      <Stack gap="2">
        <StatusIndicator tone="blocker">
          No numbers until the marked fields are corrected.
        </StatusIndicator>
        {preview.others.length > 0 && (
          <List.Root ps="5">
            {preview.others.map((message) => (
              <List.Item key={message}>{message}</List.Item>
            ))}
          </List.Root>
        )}
      </Stack>
    );
  }

  return (
    <chakra.form
      onSubmit={onSubmit}
      noValidate
      aria-labelledby="observation-form-heading"
      borderWidth="1px"
      rounded="md"
      p="4"
    >
      <Stack gap="4">
        <Heading as="h4" size="sm" id="observation-form-heading">
          {observation ? 'Change the observation' : 'Add an observation'}
        </Heading>
        <Grid templateColumns={{ base: '1fr', lg: 'minmax(0, 3fr) minmax(0, 2fr)' }} gap="6">
          <Stack gap="4">
            <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
              <FormField label={LABELS.targetId} error={liveError('targetId')} required>
                <Select {...register('targetId', { required: 'Choose a target.' })}>
                  <option value="">Choose a target</option>
                  {targets.map((t) => (
                    <option key={t.id} value={t.id}>
                      {t.name}
                    </option>
                  ))}
                </Select>
              </FormField>
              <FormField label={LABELS.bandId} error={liveError('bandId')} required>
                <Select {...register('bandId', { required: 'Choose a receiver band.' })}>
                  <option value="">Choose a band</option>
                  {observatory.bands.map((b) => (
                    <option key={b.id} value={b.id}>
                      {b.name} ({formatNumber(b.minGHz)}–{formatNumber(b.maxGHz)} GHz)
                    </option>
                  ))}
                </Select>
              </FormField>
              <FormField
                label={LABELS.configurationId}
                error={liveError('configurationId')}
                required
              >
                <Select {...register('configurationId', { required: 'Choose a configuration.' })}>
                  <option value="">Choose a configuration</option>
                  {observatory.configurations.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name} ({formatNumber(c.shortestBaselineM)}–
                      {formatNumber(c.longestBaselineM)} m, {dates(c.inUseFrom, c.inUseTo)})
                    </option>
                  ))}
                </Select>
              </FormField>
            </SimpleGrid>
            <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
              <FormField
                label={LABELS.frequencySource}
                error={liveError('frequencySource')}
                helperText={
                  target?.line
                    ? `${target.name}: rest ${formatNumber(target.line.restGHz, 7)} GHz`
                    : undefined
                }
              >
                <Select {...register('frequencySource')}>
                  <option value="sky">A sky frequency I give</option>
                  <option value="line" disabled={!target?.line}>
                    The target&apos;s line{target && !target.line ? ' (it has none)' : ''}
                  </option>
                </Select>
              </FormField>
              {values.frequencySource === 'sky' ? (
                <FormField label={LABELS.frequencyGHz} error={liveError('frequencyGHz')} required>
                  <Input
                    inputMode="decimal"
                    autoComplete="off"
                    {...register('frequencyGHz', required('frequencyGHz'))}
                  />
                </FormField>
              ) : (
                <Text alignSelf="end" pb="2" color="fg.muted" data-quantity="line-frequency">
                  {preview.status === 'ready'
                    ? `Sky frequency ${formatNumber(preview.result.skyFrequencyGHz, 6)} GHz from the line`
                    : 'Sky frequency from the line'}
                </Text>
              )}
              <FormField
                label={LABELS.bandwidthMHz}
                error={liveError('bandwidthMHz')}
                required
                helperText={
                  band
                    ? `At most ${formatNumber(band.maxBandwidthMHz)} MHz in this band.`
                    : undefined
                }
              >
                <Input
                  inputMode="decimal"
                  autoComplete="off"
                  {...register('bandwidthMHz', required('bandwidthMHz'))}
                />
              </FormField>
              <FormField
                label={LABELS.spectralResolutionKHz}
                error={liveError('spectralResolutionKHz')}
                helperText="Channel width; leave empty for continuum."
              >
                <Input
                  inputMode="decimal"
                  autoComplete="off"
                  {...register('spectralResolutionKHz')}
                />
              </FormField>
              <FormField label={LABELS.polarizations} error={liveError('polarizations')}>
                <Select {...register('polarizations')}>
                  {(band?.polarizations ?? [1, 2]).map((p) => (
                    <option key={p} value={String(p)}>
                      {p === 1 ? 'One' : 'Two'}
                    </option>
                  ))}
                </Select>
              </FormField>
              <FormField
                label={LABELS.rmsGoalMicroJy}
                error={liveError('rmsGoalMicroJy')}
                helperText="The image noise the science needs."
              >
                <Input inputMode="decimal" autoComplete="off" {...register('rmsGoalMicroJy')} />
              </FormField>
              <FormField
                label={LABELS.resolutionGoalArcsec}
                error={liveError('resolutionGoalArcsec')}
              >
                <Input
                  inputMode="decimal"
                  autoComplete="off"
                  {...register('resolutionGoalArcsec')}
                />
              </FormField>
              <FormField
                label={LABELS.hoursAsked}
                error={liveError('hoursAsked')}
                required
                helperText={`Total: every pointing and the ${formatNumber(observatory.overheadFraction * 100)} % calibration overhead included.`}
              >
                <Input
                  inputMode="decimal"
                  autoComplete="off"
                  {...register('hoursAsked', required('hoursAsked'))}
                />
              </FormField>
            </SimpleGrid>
          </Stack>
          <Box as="section" aria-label="The calculator's numbers">
            {numbers}
          </Box>
        </Grid>
        <FormError error={errors.root?.server} />
        <WriteError error={apartFromFields(save.error)} reference={reference} />
        <HStack gap="3" wrap="wrap">
          <Button type="submit" loading={save.isPending} disabled={preview.status === 'invalid'}>
            {observation ? 'Save the observation' : 'Add the observation'}
          </Button>
          <Button variant="outline" onClick={onDone}>
            Cancel
          </Button>
          {preview.status === 'ready' &&
            preview.result.checks.some((c) => c.level === 'blocker') && (
              <Text fontSize="sm" color="fg.muted">
                You can save it with{' '}
                {plural(
                  preview.result.checks.filter((c) => c.level === 'blocker').length,
                  'blocker',
                )}
                , but not submit the proposal until they are cleared.
              </Text>
            )}
        </HStack>
      </Stack>
    </chakra.form>
  );
}
