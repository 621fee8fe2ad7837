import {
  Button,
  chakra,
  Checkbox,
  Heading,
  HStack,
  Input,
  NativeSelect,
  SimpleGrid,
  Stack,
  Text,
} from '@chakra-ui/react';
import {
  CoordinateParseError,
  formatDeclination,
  formatRightAscension,
  parseDeclination,
  parseRightAscension,
  type VelocityConvention,
} from '@skyhours/calc';
import { useEffect, useMemo } from 'react';
import { Controller, useForm, useWatch, type Path } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { isApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/form-errors';
import { addTarget, type Proposal, type Target, type TargetInput, updateTarget } from '../api';
import { formatNumber, parseNumber } from '../format';
import { focusAfterNavigation } from '../focus';
import { useProposalWrite } from '../hooks';
import { apartFromFields, withFieldPaths } from '../issues';
import { WriteError } from './write-error';

export interface TargetFormValues {
  name: string;
  ra: string;
  dec: string;
  extentArcsec: string;
  fluxDensityMJy: string;
  hasLine: boolean;
  restGHz: string;
  shift: 'velocity' | 'redshift';
  velocityKmS: string;
  convention: VelocityConvention;
  redshift: string;
}

const FIELDS: Path<TargetFormValues>[] = [
  'name',
  'ra',
  'dec',
  'extentArcsec',
  'fluxDensityMJy',
  'restGHz',
  'velocityKmS',
  'convention',
  'redshift',
];

/** The server's paths (and the checks') to this form's fields. */
export function targetFieldOf(path: string): Path<TargetFormValues> | null {
  const bare = path.replace(/^target\./, '').replace(/^line\./, '');
  const aliases: Record<string, Path<TargetFormValues>> = {
    raDeg: 'ra',
    decDeg: 'dec',
    fluxMJy: 'fluxDensityMJy',
    line: 'restGHz',
  };
  const field = aliases[bare] ?? bare;
  return (FIELDS as string[]).includes(field) ? (field as Path<TargetFormValues>) : null;
}

const text = (x: number | null | undefined) => (x === null || x === undefined ? '' : String(x));

function valuesOf(target: Target | undefined): TargetFormValues {
  const line = target?.line ?? null;
  return {
    name: target?.name ?? '',
    ra: target ? formatRightAscension(target.raDeg, 2) : '',
    dec: target ? formatDeclination(target.decDeg, 1) : '',
    extentArcsec: target ? String(target.extentArcsec) : '0',
    fluxDensityMJy: text(target?.fluxDensityMJy),
    hasLine: line !== null,
    restGHz: text(line?.restGHz),
    shift: line?.redshift !== undefined && line?.redshift !== null ? 'redshift' : 'velocity',
    velocityKmS: text(line?.velocityKmS ?? (line ? 0 : null)),
    convention: line?.convention ?? 'radio',
    redshift: text(line?.redshift),
  };
}

type Parsed = { deg: number; text: string } | { error: string } | null;

function parseCoordinate(kind: 'ra' | 'dec', value: string): Parsed {
  if (value.trim() === '') return null;
  try {
    const deg = kind === 'ra' ? parseRightAscension(value) : parseDeclination(value);
    return {
      deg,
      text: kind === 'ra' ? formatRightAscension(deg, 2) : formatDeclination(deg, 1),
    };
  } catch (error) {
    if (error instanceof CoordinateParseError) return { error: error.message };
    throw error;
  }
}

/** What the parser made of a coordinate, as the user types it. */
function ParsedCoordinate({ parsed, id }: { parsed: Parsed; id: string }) {
  if (parsed === null || 'error' in parsed) return null;
  return (
    <Text
      id={id}
      fontSize="sm"
      color="fg.muted"
      fontVariantNumeric="tabular-nums"
      aria-live="polite"
    >
      Read as {parsed.text} = {formatNumber(parsed.deg, 7)}°
    </Text>
  );
}

const numberRule = (label: string, options: { required?: boolean; min?: number } = {}) => ({
  validate: (value: string) => {
    const parsed = parseNumber(value);
    if (parsed === null) return options.required ? `Give the ${label}.` : true;
    if (typeof parsed === 'object') return parsed.error;
    if (options.min !== undefined && parsed < options.min)
      return `Must be at least ${options.min}.`;
    return true;
  },
});

function inputOf(values: TargetFormValues): TargetInput {
  const num = (value: string) => {
    const parsed = parseNumber(value);
    return typeof parsed === 'number' ? parsed : null;
  };
  const restGHz = num(values.restGHz) as number;
  return {
    name: values.name.trim(),
    ra: values.ra.trim(),
    dec: values.dec.trim(),
    extentArcsec: num(values.extentArcsec) ?? 0,
    fluxDensityMJy: num(values.fluxDensityMJy),
    line: values.hasLine
      ? values.shift === 'redshift'
        ? { restGHz, redshift: num(values.redshift) ?? 0 }
        : {
            restGHz,
            velocityKmS: num(values.velocityKmS) ?? 0,
            convention: values.convention,
          }
      : null,
  };
}

export function TargetForm({
  proposal,
  target,
  onDone,
  focusField,
}: {
  proposal: Proposal;
  /** The target being changed; a new one when absent. */
  target?: Target;
  onDone: () => void;
  focusField?: string;
}) {
  const { reference } = proposal;
  const save = useProposalWrite(reference, (version, input: TargetInput) =>
    target
      ? updateTarget(reference, version, target.id, input)
      : addTarget(reference, version, input),
  );
  const {
    register,
    handleSubmit,
    setError,
    setFocus,
    control,
    formState: { errors },
  } = useForm<TargetFormValues>({ defaultValues: valuesOf(target) });
  const [ra, dec, hasLine, shift] = useWatch({ control, name: ['ra', 'dec', 'hasLine', 'shift'] });
  const parsedRa = useMemo(() => parseCoordinate('ra', ra), [ra]);
  const parsedDec = useMemo(() => parseCoordinate('dec', dec), [dec]);

  useEffect(() => {
    const field = focusField ? targetFieldOf(focusField) : null;
    return focusAfterNavigation(() => setFocus(field ?? 'name'));
  }, [focusField, setFocus]);

  const onSubmit = handleSubmit((values) =>
    save.mutate(inputOf(values), {
      onSuccess: onDone,
      onError: (error) => {
        if (isApiError(error, 400))
          setServerErrors(withFieldPaths(error, targetFieldOf), setError, FIELDS);
      },
    }),
  );

  const liveError = (parsed: Parsed) => (parsed && 'error' in parsed ? parsed.error : undefined);
  const heading = target ? `Change ${target.name}` : 'Add a target';

  return (
    <chakra.form
      onSubmit={onSubmit}
      noValidate
      aria-labelledby="target-form-heading"
      borderWidth="1px"
      rounded="md"
      p="4"
    >
      <Stack gap="4">
        <Heading as="h4" size="sm" id="target-form-heading">
          {heading}
        </Heading>
        <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
          <FormField label="Name" error={errors.name} required>
            <Input
              autoComplete="off"
              {...register('name', {
                validate: (value) => value.trim() !== '' || 'Give the target a name.',
              })}
            />
          </FormField>
          <FormField
            label="Right ascension (ICRS)"
            error={errors.ra?.message ?? liveError(parsedRa)}
            required
            helperText={
              parsedRa && !('error' in parsedRa) ? (
                <ParsedCoordinate parsed={parsedRa} id="ra-read" />
              ) : (
                'hh:mm:ss.s, 10h00m24s or decimal degrees'
              )
            }
          >
            <Input
              autoComplete="off"
              spellCheck={false}
              fontVariantNumeric="tabular-nums"
              {...register('ra', {
                validate: (value) => {
                  const parsed = parseCoordinate('ra', value);
                  if (parsed === null) return 'Give the right ascension.';
                  return 'error' in parsed ? parsed.error : true;
                },
              })}
            />
          </FormField>
          <FormField
            label="Declination (ICRS)"
            error={errors.dec?.message ?? liveError(parsedDec)}
            required
            helperText={
              parsedDec && !('error' in parsedDec) ? (
                <ParsedCoordinate parsed={parsedDec} id="dec-read" />
              ) : (
                '±dd:mm:ss, 22d30m00s or decimal degrees'
              )
            }
          >
            <Input
              autoComplete="off"
              spellCheck={false}
              fontVariantNumeric="tabular-nums"
              {...register('dec', {
                validate: (value) => {
                  const parsed = parseCoordinate('dec', value);
                  if (parsed === null) return 'Give the declination.';
                  return 'error' in parsed ? parsed.error : true;
                },
              })}
            />
          </FormField>
          <FormField
            label="Angular extent (″)"
            error={errors.extentArcsec}
            required
            helperText="Diameter of the region to image; 0 for a point source."
          >
            <Input
              inputMode="decimal"
              {...register('extentArcsec', numberRule('extent', { required: true, min: 0 }))}
            />
          </FormField>
          <FormField label="Expected flux density (mJy)" error={errors.fluxDensityMJy}>
            <Input
              inputMode="decimal"
              {...register('fluxDensityMJy', numberRule('flux density'))}
            />
          </FormField>
        </SimpleGrid>

        <Controller
          control={control}
          name="hasLine"
          render={({ field }) => (
            <Checkbox.Root
              checked={field.value}
              onCheckedChange={(details) => field.onChange(details.checked === true)}
            >
              <Checkbox.HiddenInput name={field.name} onBlur={field.onBlur} />
              <Checkbox.Control />
              <Checkbox.Label>A line target: observe a spectral line</Checkbox.Label>
            </Checkbox.Root>
          )}
        />
        {hasLine && (
          <SimpleGrid columns={{ base: 1, md: 4 }} gap="4">
            <FormField label="Rest frequency (GHz)" error={errors.restGHz} required>
              <Input
                inputMode="decimal"
                {...register('restGHz', numberRule('rest frequency', { required: true }))}
              />
            </FormField>
            <FormField label="Shift given as">
              <NativeSelect.Root>
                <NativeSelect.Field {...register('shift')}>
                  <option value="velocity">Velocity</option>
                  <option value="redshift">Redshift</option>
                </NativeSelect.Field>
                <NativeSelect.Indicator />
              </NativeSelect.Root>
            </FormField>
            {shift === 'velocity' ? (
              <>
                <FormField label="Velocity (km/s)" error={errors.velocityKmS} required>
                  <Input
                    inputMode="decimal"
                    {...register('velocityKmS', numberRule('velocity', { required: true }))}
                  />
                </FormField>
                <FormField label="Velocity convention" error={errors.convention}>
                  <NativeSelect.Root>
                    <NativeSelect.Field {...register('convention')}>
                      <option value="radio">Radio</option>
                      <option value="optical">Optical</option>
                      <option value="relativistic">Relativistic</option>
                    </NativeSelect.Field>
                    <NativeSelect.Indicator />
                  </NativeSelect.Root>
                </FormField>
              </>
            ) : (
              <FormField label="Redshift z" error={errors.redshift} required>
                <Input
                  inputMode="decimal"
                  {...register('redshift', numberRule('redshift', { required: true }))}
                />
              </FormField>
            )}
          </SimpleGrid>
        )}
        <FormError error={errors.root?.server} />
        <WriteError error={apartFromFields(save.error)} reference={reference} />
        <HStack gap="3">
          <Button type="submit" loading={save.isPending}>
            {target ? 'Save the target' : 'Add the target'}
          </Button>
          <Button variant="outline" onClick={onDone}>
            Cancel
          </Button>
          {Object.keys(errors).length > 0 && (
            <StatusIndicator tone="blocker" fontSize="sm">
              Correct the marked fields
            </StatusIndicator>
          )}
        </HStack>
      </Stack>
    </chakra.form>
  );
}
