import {
  Button,
  Fieldset,
  HStack,
  Input,
  InputGroup,
  NativeSelect,
  SimpleGrid,
  Stack,
} from '@chakra-ui/react';
import { useMemo } from 'react';
import { useForm } from 'react-hook-form';
import { FormError, FormField } from '@/components/ui/form-field';
import { setServerErrors } from '@/lib/form-errors';
import type { Observatory, SiteInput } from '../api';
import { numberRule } from './number-rule';

type SiteValues = Record<Exclude<keyof SiteInput, 'name' | 'timeZone'>, string> & {
  name: string;
  timeZone: string;
};

const NUMERIC: {
  name: Exclude<keyof SiteValues, 'name' | 'timeZone'>;
  label: string;
  unit?: string;
  min: number;
  max: number;
  integer?: boolean;
  help?: string;
}[] = [
  { name: 'latitudeDeg', label: 'Latitude', unit: '°', min: -90, max: 90, help: 'North positive' },
  {
    name: 'longitudeDeg',
    label: 'Longitude',
    unit: '°',
    min: -180,
    max: 180,
    help: 'East positive, west negative',
  },
  { name: 'elevationM', label: 'Site elevation', unit: 'm', min: -500, max: 9000 },
  {
    name: 'elevationLimitDeg',
    label: 'Elevation limit',
    unit: '°',
    min: 0,
    max: 89,
    help: 'Lowest elevation observed at',
  },
  { name: 'antennas', label: 'Antennas', min: 2, max: 10000, integer: true },
  { name: 'dishDiameterM', label: 'Dish diameter', unit: 'm', min: 0.1, max: 1000 },
  {
    name: 'correlatorEfficiency',
    label: 'Correlator efficiency',
    min: 0.01,
    max: 1,
    help: 'Between 0 and 1',
  },
  {
    name: 'overheadFraction',
    label: 'Calibration overhead',
    min: 0,
    max: 5,
    help: 'Fraction of on-source time, e.g. 0.2',
  },
  {
    name: 'beamFactor',
    label: 'Beam factor',
    min: 0.5,
    max: 2,
    help: 'Primary beam = factor × λ/D',
  },
];

const ZONES = (() => {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
})();

const toValues = (o: Observatory | undefined): SiteValues => ({
  name: o?.name ?? '',
  timeZone: o?.timeZone ?? 'UTC',
  latitudeDeg: o ? String(o.latitudeDeg) : '',
  longitudeDeg: o ? String(o.longitudeDeg) : '',
  elevationM: o ? String(o.elevationM) : '',
  elevationLimitDeg: o ? String(o.elevationLimitDeg) : '15',
  antennas: o ? String(o.antennas) : '',
  dishDiameterM: o ? String(o.dishDiameterM) : '',
  correlatorEfficiency: o ? String(o.correlatorEfficiency) : '0.9',
  overheadFraction: o ? String(o.overheadFraction) : '0.2',
  beamFactor: o ? String(o.beamFactor) : '1.13',
});

/** The array's site and instrument numbers; saves the whole set at once. */
export function SiteForm({
  observatory,
  pending,
  onSave,
}: {
  observatory?: Observatory;
  pending: boolean;
  onSave: (input: SiteInput) => Promise<unknown>;
}) {
  const defaults = useMemo(() => toValues(observatory), [observatory]);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isDirty },
  } = useForm<SiteValues>({ values: defaults });
  const zones = ZONES.includes(defaults.timeZone) ? ZONES : [defaults.timeZone, ...ZONES];

  const submit = handleSubmit(async (values) => {
    const input = {
      name: values.name.trim(),
      timeZone: values.timeZone,
      ...Object.fromEntries(NUMERIC.map((f) => [f.name, Number(values[f.name])])),
    } as SiteInput;
    try {
      await onSave(input);
    } catch (error) {
      setServerErrors(error, setError, ['name', 'timeZone', ...NUMERIC.map((f) => f.name)]);
    }
  });

  return (
    <Stack asChild gap="6">
      <form onSubmit={submit} noValidate aria-label="Site and instrument">
        <Fieldset.Root>
          <Fieldset.Content>
            <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
              <FormField label="Name" error={errors.name} required>
                <Input {...register('name', { required: 'Give the array a name' })} />
              </FormField>
              <FormField label="Time zone of the site" error={errors.timeZone} required>
                <NativeSelect.Root>
                  <NativeSelect.Field {...register('timeZone', { required: 'Choose the zone' })}>
                    {zones.map((zone) => (
                      <option key={zone} value={zone}>
                        {zone}
                      </option>
                    ))}
                  </NativeSelect.Field>
                  <NativeSelect.Indicator />
                </NativeSelect.Root>
              </FormField>
            </SimpleGrid>
            <SimpleGrid columns={{ base: 1, sm: 2, lg: 3 }} gap="4">
              {NUMERIC.map((field) => (
                <FormField
                  key={field.name}
                  label={field.label}
                  error={errors[field.name]}
                  helperText={field.help}
                  required
                >
                  {field.unit ? (
                    <InputGroup endElement={field.unit}>
                      <Input
                        inputMode="decimal"
                        {...register(field.name, numberRule(field.label.toLowerCase(), field))}
                      />
                    </InputGroup>
                  ) : (
                    <Input
                      inputMode="decimal"
                      {...register(field.name, numberRule(field.label.toLowerCase(), field))}
                    />
                  )}
                </FormField>
              ))}
            </SimpleGrid>
          </Fieldset.Content>
        </Fieldset.Root>
        <Stack gap="3">
          <FormError error={errors.root?.server} />
          <HStack>
            <Button type="submit" loading={pending} disabled={Boolean(observatory) && !isDirty}>
              {observatory ? 'Save the site' : 'Create the array'}
            </Button>
          </HStack>
        </Stack>
      </form>
    </Stack>
  );
}
