import {
  Button,
  Checkbox,
  CheckboxGroup,
  Fieldset,
  HStack,
  Input,
  InputGroup,
  NativeSelect,
  SimpleGrid,
  Stack,
  Text,
  Textarea,
} from '@chakra-ui/react';
import { useMemo } from 'react';
import { Controller, type Path, useForm, useWatch } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { ApiError, isApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/form-errors';
import { formatInstant, formatUtc, viewerTimeZone } from '@/lib/time';
import {
  type Call,
  type CallFormObservatory,
  type CallInput,
  type CallStatus,
  CALL_STATUSES,
  PROPOSAL_KINDS,
  type ProposalKind,
} from '../api';
import { KIND_LABELS, STATUS_LABELS } from '../labels';
import { instantToZoned, isValidZone, zonedToInstant } from '../zoned-time';

export interface CallFormValues {
  code: string;
  observatoryId: string;
  title: string;
  description: string;
  timeZone: string;
  /** Wall-clock times in the call's zone (`YYYY-MM-DDTHH:mm`). */
  opensLocal: string;
  deadlineLocal: string;
  reviewDueLocal: string;
  /** Hours on offer by configuration id; empty means not on offer. */
  hours: Record<string, string>;
  scienceCasePageLimit: string;
  scienceCaseMaxMb: string;
  proposalKinds: ProposalKind[];
  maxHoursPerProposal: string;
  scoreMin: string;
  scoreMax: string;
  scoreDirection: 'higher' | 'lower';
  refereesPerProposal: string;
  anonymousReview: boolean;
}

/** The API's field names where the form uses others. */
const SERVER_FIELDS: Record<string, Path<CallFormValues>> = {
  opensAt: 'opensLocal',
  deadlineAt: 'deadlineLocal',
  reviewDueAt: 'reviewDueLocal',
  scoreHigherIsBetter: 'scoreDirection',
};

/**
 * The last status in which staff may change each field, as the server enforces it (the server
 * decides; this only keeps the form from offering what would be refused).
 */
const EDITABLE_UNTIL: Partial<Record<Path<CallFormValues>, CallStatus>> = {
  opensLocal: 'open',
  deadlineLocal: 'open',
  reviewDueLocal: 'in_review',
  scienceCasePageLimit: 'open',
  scienceCaseMaxMb: 'open',
  proposalKinds: 'open',
  maxHoursPerProposal: 'open',
  scoreMin: 'closed',
  scoreMax: 'closed',
  scoreDirection: 'closed',
  refereesPerProposal: 'closed',
  anonymousReview: 'closed',
};

const ZONES = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();

export function emptyCallValues(observatory: CallFormObservatory | undefined): CallFormValues {
  return {
    code: '',
    observatoryId: observatory?.id ?? '',
    title: '',
    description: '',
    timeZone: observatory?.timeZone ?? viewerTimeZone(),
    opensLocal: '',
    deadlineLocal: '',
    reviewDueLocal: '',
    hours: {},
    scienceCasePageLimit: '4',
    scienceCaseMaxMb: '10',
    proposalKinds: ['standard', 'large', 'target_of_opportunity'],
    maxHoursPerProposal: '100',
    scoreMin: '1',
    scoreMax: '10',
    scoreDirection: 'higher',
    refereesPerProposal: '3',
    anonymousReview: false,
  };
}

export function callToValues(call: Call): CallFormValues {
  return {
    code: call.code,
    observatoryId: call.observatory.id,
    title: call.title,
    description: call.description,
    timeZone: call.timeZone,
    opensLocal: instantToZoned(call.opensAt, call.timeZone),
    deadlineLocal: instantToZoned(call.deadlineAt, call.timeZone),
    reviewDueLocal: instantToZoned(call.reviewDueAt, call.timeZone),
    hours: Object.fromEntries(call.capacity.map((c) => [c.configurationId, String(c.hours)])),
    scienceCasePageLimit: String(call.scienceCasePageLimit),
    scienceCaseMaxMb: String(call.scienceCaseMaxMb),
    proposalKinds: call.proposalKinds,
    maxHoursPerProposal: String(call.maxHoursPerProposal),
    scoreMin: String(call.scoreMin),
    scoreMax: String(call.scoreMax),
    scoreDirection: call.scoreHigherIsBetter ? 'higher' : 'lower',
    refereesPerProposal: String(call.refereesPerProposal),
    anonymousReview: call.anonymousReview,
  };
}

/** The API's body from the form's values (instants from wall-clock times in the call's zone). */
export function valuesToInput(
  values: CallFormValues,
  configurations: CallFormObservatory['configurations'],
): CallInput {
  const instant = (local: string) => zonedToInstant(local, values.timeZone)?.toISOString() ?? '';
  return {
    code: values.code.trim().toUpperCase(),
    observatoryId: values.observatoryId,
    title: values.title.trim(),
    description: values.description,
    timeZone: values.timeZone,
    opensAt: instant(values.opensLocal),
    deadlineAt: instant(values.deadlineLocal),
    reviewDueAt: instant(values.reviewDueLocal),
    capacity: configurations
      .filter((c) => (values.hours[c.id] ?? '').trim() !== '' && Number(values.hours[c.id]) !== 0)
      .map((c) => ({ configurationId: c.id, hours: Number(values.hours[c.id]) })),
    scienceCasePageLimit: Number(values.scienceCasePageLimit),
    scienceCaseMaxMb: Number(values.scienceCaseMaxMb),
    proposalKinds: values.proposalKinds,
    maxHoursPerProposal: Number(values.maxHoursPerProposal),
    scoreMin: Number(values.scoreMin),
    scoreMax: Number(values.scoreMax),
    scoreHigherIsBetter: values.scoreDirection === 'higher',
    refereesPerProposal: Number(values.refereesPerProposal),
    anonymousReview: values.anonymousReview,
  };
}

/** Server issues renamed to the form's fields (`capacity.1.hours` → `hours.<configuration id>`). */
function toFormError(error: unknown, sent: CallInput): unknown {
  if (!isApiError(error) || error.issues.length === 0) return error;
  const issues = error.issues.map((issue) => {
    const capacity = /^capacity\.(\d+)\./.exec(issue.path);
    if (capacity) {
      const row = sent.capacity[Number(capacity[1])];
      return { ...issue, path: row ? `hours.${row.configurationId}` : 'capacity' };
    }
    return { ...issue, path: SERVER_FIELDS[issue.path] ?? issue.path };
  });
  return new ApiError(error.status, error.code, error.message, { issues, body: error.body });
}

const number = (message: string, { min, integer = false }: { min: number; integer?: boolean }) => ({
  required: message,
  validate: (v: string) => {
    const n = Number(v);
    if (v.trim() === '' || !Number.isFinite(n)) return message;
    if (integer && !Number.isInteger(n)) return 'Give a whole number';
    if (n < min) return `At least ${min}`;
    return true;
  },
});

function ZonedPreview({ local, zone }: { local: string; zone: string }) {
  const instant = local ? zonedToInstant(local, zone) : null;
  if (!instant) return null;
  const mine = viewerTimeZone();
  return (
    <>
      {formatUtc(instant)}
      {mine !== zone ? ` · ${formatInstant(instant)} in your zone` : ''}
    </>
  );
}

export interface CallFormProps {
  mode: 'create' | 'edit';
  observatories: CallFormObservatory[];
  defaultValues: CallFormValues;
  /** Edit mode: the call's status decides which fields can still change. */
  status?: CallStatus;
  submitLabel: string;
  pending: boolean;
  onSubmit: (input: CallInput) => Promise<unknown>;
  onCancel: () => void;
}

/**
 * Staff's form for a call. Dates are typed as wall-clock times in the call's own zone and sent
 * as instants; under each, the same moment in UTC (and the viewer's zone), so nobody misreads it.
 */
export function CallForm({
  mode,
  observatories,
  defaultValues,
  status = 'planned',
  submitLabel,
  pending,
  onSubmit,
  onCancel,
}: CallFormProps) {
  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    formState: { errors },
  } = useForm<CallFormValues>({ defaultValues });
  const [observatoryId, timeZone, opensLocal, deadlineLocal, reviewDueLocal] = useWatch({
    control,
    name: ['observatoryId', 'timeZone', 'opensLocal', 'deadlineLocal', 'reviewDueLocal'],
  });
  const observatory = observatories.find((o) => o.id === observatoryId);
  const configurations = useMemo(() => observatory?.configurations ?? [], [observatory]);
  const zones = useMemo(
    () => (ZONES.includes(defaultValues.timeZone) ? ZONES : [defaultValues.timeZone, ...ZONES]),
    [defaultValues.timeZone],
  );
  // Hundreds of zones: build the options once, not on every keystroke elsewhere in the form.
  const zoneOptions = useMemo(
    () =>
      zones.map((zone) => (
        <option key={zone} value={zone}>
          {zone}
        </option>
      )),
    [zones],
  );
  const locked = (field: Path<CallFormValues>) => {
    const until = EDITABLE_UNTIL[field];
    return (
      mode === 'edit' &&
      until !== undefined &&
      CALL_STATUSES.indexOf(status) > CALL_STATUSES.indexOf(until)
    );
  };
  const lockedNote = `Cannot change once the call is ${STATUS_LABELS[status].toLowerCase()}`;
  const capacityLocked =
    mode === 'edit' && CALL_STATUSES.indexOf(status) > CALL_STATUSES.indexOf('deliberation');

  const localTime = (message: string) => ({
    required: message,
    validate: (v: string) =>
      zonedToInstant(v, timeZone) !== null || 'Give a date and a time, e.g. 2027-01-15 17:00',
  });

  const submit = handleSubmit(async (values) => {
    const input = valuesToInput(values, configurations);
    try {
      await onSubmit(input);
    } catch (error) {
      setServerErrors(toFormError(error, input), setError, [
        'code',
        'observatoryId',
        'title',
        'description',
        'timeZone',
        'opensLocal',
        'deadlineLocal',
        'reviewDueLocal',
        'scienceCasePageLimit',
        'scienceCaseMaxMb',
        'proposalKinds',
        'maxHoursPerProposal',
        'scoreMin',
        'scoreMax',
        'scoreDirection',
        'refereesPerProposal',
        'anonymousReview',
        ...configurations.map((c) => `hours.${c.id}` as Path<CallFormValues>),
      ]);
    }
  });

  return (
    <Stack asChild gap="8" maxW="4xl">
      <form onSubmit={submit} noValidate>
        <Fieldset.Root>
          <Fieldset.Legend fontSize="lg" fontWeight="semibold">
            The call
          </Fieldset.Legend>
          <Fieldset.Content>
            <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
              <FormField
                label="Code"
                error={errors.code}
                required
                helperText={
                  mode === 'create'
                    ? 'Letters and digits, e.g. SP27; proposal references start with it. It cannot change later.'
                    : 'The code cannot change.'
                }
              >
                <Input
                  {...register('code', {
                    required: 'Give the call a code',
                    pattern: {
                      value: /^[A-Za-z][A-Za-z0-9-]{1,15}$/,
                      message: '2–16 letters, digits or dashes, starting with a letter',
                    },
                  })}
                  readOnly={mode === 'edit'}
                  fontFamily="mono"
                  textTransform="uppercase"
                  autoComplete="off"
                />
              </FormField>
              <FormField label="Observatory" error={errors.observatoryId} required>
                <NativeSelect.Root disabled={mode === 'edit'}>
                  <NativeSelect.Field
                    {...register('observatoryId', {
                      required: 'Choose the array',
                      onChange: (event: { target: { value: string } }) => {
                        const chosen = observatories.find((o) => o.id === event.target.value);
                        if (chosen) setValue('timeZone', chosen.timeZone);
                        setValue('hours', {});
                      },
                    })}
                  >
                    {observatories.map((o) => (
                      <option key={o.id} value={o.id}>
                        {o.name}
                      </option>
                    ))}
                  </NativeSelect.Field>
                  <NativeSelect.Indicator />
                </NativeSelect.Root>
              </FormField>
            </SimpleGrid>
            <FormField label="Title" error={errors.title} required>
              <Input
                {...register('title', {
                  required: 'Give the call a title',
                  minLength: { value: 3, message: 'At least 3 characters' },
                })}
              />
            </FormField>
            <FormField
              label="Description"
              error={errors.description}
              helperText="Shown on the call's page."
            >
              <Textarea rows={4} {...register('description')} />
            </FormField>
          </Fieldset.Content>
        </Fieldset.Root>

        <Fieldset.Root>
          <Fieldset.Legend fontSize="lg" fontWeight="semibold">
            Dates
          </Fieldset.Legend>
          <Fieldset.HelperText>
            Enter the times as the clock reads in the call&apos;s zone; they are stored as instants.
          </Fieldset.HelperText>
          <Fieldset.Content>
            <FormField label="Time zone of the call" error={errors.timeZone} required maxW="sm">
              <NativeSelect.Root>
                <NativeSelect.Field
                  {...register('timeZone', {
                    validate: (v) => isValidZone(v) || 'Choose a time zone',
                  })}
                >
                  {zoneOptions}
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </FormField>
            <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
              <FormField
                label="Opens"
                error={errors.opensLocal}
                required
                helperText={
                  locked('opensLocal') ? (
                    lockedNote
                  ) : (
                    <ZonedPreview local={opensLocal} zone={timeZone} />
                  )
                }
              >
                <Input
                  type="datetime-local"
                  readOnly={locked('opensLocal')}
                  {...register('opensLocal', localTime('Give the opening'))}
                />
              </FormField>
              <FormField
                label="Deadline"
                error={errors.deadlineLocal}
                required
                helperText={
                  locked('deadlineLocal') ? (
                    lockedNote
                  ) : (
                    <ZonedPreview local={deadlineLocal} zone={timeZone} />
                  )
                }
              >
                <Input
                  type="datetime-local"
                  readOnly={locked('deadlineLocal')}
                  {...register('deadlineLocal', localTime('Give the deadline'))}
                />
              </FormField>
              <FormField
                label="Reviews due"
                error={errors.reviewDueLocal}
                required
                helperText={
                  locked('reviewDueLocal') ? (
                    lockedNote
                  ) : (
                    <ZonedPreview local={reviewDueLocal} zone={timeZone} />
                  )
                }
              >
                <Input
                  type="datetime-local"
                  readOnly={locked('reviewDueLocal')}
                  {...register('reviewDueLocal', localTime('Give the review due date'))}
                />
              </FormField>
            </SimpleGrid>
          </Fieldset.Content>
        </Fieldset.Root>

        <Fieldset.Root disabled={capacityLocked}>
          <Fieldset.Legend fontSize="lg" fontWeight="semibold">
            Hours on offer
          </Fieldset.Legend>
          <Fieldset.HelperText>
            Leave a configuration empty to offer no time in it. A call opens only with time on
            offer.
          </Fieldset.HelperText>
          <Fieldset.Content>
            {configurations.length === 0 ? (
              <Text color="fg.muted">
                This array has no configurations yet; add them in the array setup.
              </Text>
            ) : (
              <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
                {configurations.map((c) => (
                  <FormField
                    key={c.id}
                    label={`${c.name}`}
                    helperText={`Baselines ${c.shortestBaselineM} m to ${c.longestBaselineM} m`}
                    error={errors.hours?.[c.id]}
                  >
                    <InputGroup endElement="h">
                      <Input
                        inputMode="decimal"
                        {...register(`hours.${c.id}`, {
                          validate: (v) =>
                            !v ||
                            v.trim() === '' ||
                            (Number.isFinite(Number(v)) && Number(v) >= 0) ||
                            'Give hours as a number (or leave empty)',
                        })}
                      />
                    </InputGroup>
                  </FormField>
                ))}
              </SimpleGrid>
            )}
          </Fieldset.Content>
        </Fieldset.Root>

        <Fieldset.Root>
          <Fieldset.Legend fontSize="lg" fontWeight="semibold">
            Proposals
          </Fieldset.Legend>
          <Fieldset.Content>
            <FormField
              label="Proposal kinds accepted"
              error={errors.proposalKinds?.message}
              required
            >
              <Controller
                control={control}
                name="proposalKinds"
                rules={{ validate: (v) => v.length > 0 || 'Accept at least one kind' }}
                render={({ field }) => (
                  <CheckboxGroup
                    value={field.value}
                    onValueChange={(value) => field.onChange(value as ProposalKind[])}
                    name={field.name}
                    disabled={locked('proposalKinds')}
                  >
                    <HStack gap="5" wrap="wrap">
                      {PROPOSAL_KINDS.map((kind) => (
                        <Checkbox.Root key={kind} value={kind}>
                          <Checkbox.HiddenInput onBlur={field.onBlur} />
                          <Checkbox.Control />
                          <Checkbox.Label>{KIND_LABELS[kind]}</Checkbox.Label>
                        </Checkbox.Root>
                      ))}
                    </HStack>
                  </CheckboxGroup>
                )}
              />
            </FormField>
            <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
              <FormField
                label="Largest request per proposal"
                error={errors.maxHoursPerProposal}
                required
                helperText={locked('maxHoursPerProposal') ? lockedNote : undefined}
              >
                <InputGroup endElement="h">
                  <Input
                    inputMode="decimal"
                    readOnly={locked('maxHoursPerProposal')}
                    {...register(
                      'maxHoursPerProposal',
                      number('Give the largest request in hours', { min: 0.1 }),
                    )}
                  />
                </InputGroup>
              </FormField>
              <FormField
                label="Science case page limit"
                error={errors.scienceCasePageLimit}
                required
                helperText={locked('scienceCasePageLimit') ? lockedNote : undefined}
              >
                <InputGroup endElement="pages">
                  <Input
                    inputMode="numeric"
                    readOnly={locked('scienceCasePageLimit')}
                    {...register(
                      'scienceCasePageLimit',
                      number('Give the page limit', { min: 1, integer: true }),
                    )}
                  />
                </InputGroup>
              </FormField>
              <FormField
                label="Science case size limit"
                error={errors.scienceCaseMaxMb}
                required
                helperText={locked('scienceCaseMaxMb') ? lockedNote : undefined}
              >
                <InputGroup endElement="MB">
                  <Input
                    inputMode="decimal"
                    readOnly={locked('scienceCaseMaxMb')}
                    {...register(
                      'scienceCaseMaxMb',
                      number('Give the size limit in MB', { min: 0.1 }),
                    )}
                  />
                </InputGroup>
              </FormField>
            </SimpleGrid>
          </Fieldset.Content>
        </Fieldset.Root>

        <Fieldset.Root>
          <Fieldset.Legend fontSize="lg" fontWeight="semibold">
            Review
          </Fieldset.Legend>
          <Fieldset.Content>
            <SimpleGrid columns={{ base: 2, md: 4 }} gap="4">
              <FormField label="Lowest score" error={errors.scoreMin} required>
                <Input
                  inputMode="numeric"
                  readOnly={locked('scoreMin')}
                  {...register(
                    'scoreMin',
                    number('Give the lowest score', { min: -100, integer: true }),
                  )}
                />
              </FormField>
              <FormField label="Highest score" error={errors.scoreMax} required>
                <Input
                  inputMode="numeric"
                  readOnly={locked('scoreMax')}
                  {...register(
                    'scoreMax',
                    number('Give the highest score', { min: -100, integer: true }),
                  )}
                />
              </FormField>
              <FormField label="Better scores are" error={errors.scoreDirection}>
                <NativeSelect.Root disabled={locked('scoreDirection')}>
                  <NativeSelect.Field {...register('scoreDirection')}>
                    <option value="higher">Higher</option>
                    <option value="lower">Lower</option>
                  </NativeSelect.Field>
                  <NativeSelect.Indicator />
                </NativeSelect.Root>
              </FormField>
              <FormField label="Referees per proposal" error={errors.refereesPerProposal} required>
                <Input
                  inputMode="numeric"
                  readOnly={locked('refereesPerProposal')}
                  {...register(
                    'refereesPerProposal',
                    number('Give the number of referees', { min: 1, integer: true }),
                  )}
                />
              </FormField>
            </SimpleGrid>
            <Controller
              control={control}
              name="anonymousReview"
              render={({ field }) => (
                <Checkbox.Root
                  checked={field.value}
                  onCheckedChange={(details) => field.onChange(details.checked === true)}
                  disabled={locked('anonymousReview')}
                >
                  <Checkbox.HiddenInput name={field.name} onBlur={field.onBlur} />
                  <Checkbox.Control />
                  <Checkbox.Label>
                    Anonymous review: referees do not see the team, and the science case must not
                    name it
                  </Checkbox.Label>
                </Checkbox.Root>
              )}
            />
          </Fieldset.Content>
        </Fieldset.Root>

        <Stack gap="3">
          <FormError error={errors.root?.server} />
          <HStack gap="3">
            <Button type="submit" loading={pending}>
              {submitLabel}
            </Button>
            <Button variant="outline" onClick={onCancel}>
              Cancel
            </Button>
          </HStack>
        </Stack>
      </form>
    </Stack>
  );
}
