import { Button, Fieldset, HStack, NativeSelect, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { CO_1_0_REST_FREQUENCY_GHZ, HI_REST_FREQUENCY_GHZ } from '@skyhours/calc';
import type { Control, UseFormRegister, UseFormSetValue } from 'react-hook-form';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { FormField } from '@/components/ui/form-field';
import type { StoredObservatory } from '../api';
import type { FieldErrors } from '../calculate';
import { formatNumber } from '../format';
import {
  ANGLE_UNITS,
  CONVENTIONS,
  FLUX_UNITS,
  FREQUENCY_UNITS,
  FIELD_LABELS,
  TIME_UNITS,
  type CalculatorValues,
  type FieldName,
} from '../form-values';
import { ChoiceGroup } from './choice-group';
import { QuantityField } from './quantity-field';

export interface CalculatorFormProps {
  values: CalculatorValues;
  control: Control<CalculatorValues>;
  register: UseFormRegister<CalculatorValues>;
  setValue: UseFormSetValue<CalculatorValues>;
  errors: FieldErrors;
  stored: { observatory: StoredObservatory | undefined; isPending: boolean; isError: boolean };
}

const frequencyUnit = { options: FREQUENCY_UNITS } as const;
const angleUnit = { options: ANGLE_UNITS } as const;

function Section({ legend, children }: { legend: string; children: React.ReactNode }) {
  return (
    <Fieldset.Root borderWidth="1px" borderColor="border" rounded="l2" p="4" gap="4">
      <Fieldset.Legend fontSize="md" fontWeight="semibold" px="1">
        {legend}
      </Fieldset.Legend>
      <Fieldset.Content mt="0" gap="4">
        {children}
      </Fieldset.Content>
    </Fieldset.Root>
  );
}

/** Copies the stored records into the custom fields, so a custom setup starts from them. */
function copyStored(
  observatory: StoredObservatory,
  values: CalculatorValues,
  setValue: UseFormSetValue<CalculatorValues>,
) {
  const configuration = observatory.configurations.find((c) => c.name === values.configuration);
  const band = observatory.bands.find((b) => b.name === values.band);
  const text = (x: number) => String(x);
  setValue('antennas', text(observatory.antennas));
  setValue('dishDiameterM', text(observatory.dishDiameterM));
  setValue('latitudeDeg', text(observatory.latitudeDeg));
  setValue('longitudeDeg', text(observatory.longitudeDeg));
  setValue('elevationLimitDeg', text(observatory.elevationLimitDeg));
  setValue('correlatorEfficiency', text(observatory.correlatorEfficiency));
  setValue('overheadPercent', text(Number((observatory.overheadFraction * 100).toPrecision(12))));
  setValue('beamFactor', text(observatory.beamFactor));
  if (configuration) {
    setValue('shortestBaselineM', text(configuration.shortestBaselineM));
    setValue('longestBaselineM', text(configuration.longestBaselineM));
  }
  if (band) {
    setValue('bandMinGHz', text(band.minGHz));
    setValue('bandMaxGHz', text(band.maxGHz));
    setValue('tsysK', text(band.tsysK));
    setValue('apertureEfficiency', text(band.apertureEfficiency));
    setValue('maxBandwidthMHz', text(band.maxBandwidthMHz));
  }
}

function StoredSetupFields({ values, register, errors, stored }: CalculatorFormProps) {
  const { observatory } = stored;
  if (stored.isPending) {
    return (
      <Text color="fg.muted" role="status">
        Loading the observatory’s configurations and bands…
      </Text>
    );
  }
  if (!observatory) {
    return (
      <StatusIndicator tone="warning" role="status">
        {stored.isError
          ? 'The observatory’s records could not be loaded: choose “Custom values”.'
          : 'No observatory is set up yet: choose “Custom values”.'}
      </StatusIndicator>
    );
  }
  const known = (names: string[], name: string) => name === '' || names.includes(name);
  return (
    <>
      <Text textStyle="sm" color="fg.muted">
        {observatory.name}: {observatory.antennas} dishes of {observatory.dishDiameterM} m at
        latitude {observatory.latitudeDeg}°, elevation limit {observatory.elevationLimitDeg}°.
      </Text>
      <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
        <FormField label={FIELD_LABELS.configuration} error={errors.configuration}>
          <NativeSelect.Root>
            <NativeSelect.Field {...register('configuration')}>
              {!known(
                observatory.configurations.map((c) => c.name),
                values.configuration,
              ) && <option value={values.configuration}>{values.configuration} (not found)</option>}
              {observatory.configurations.map((c) => (
                <option key={c.id} value={c.name}>
                  {c.name} ({formatNumber(c.shortestBaselineM)}–{formatNumber(c.longestBaselineM)}{' '}
                  m)
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
        <FormField label={FIELD_LABELS.band} error={errors.band}>
          <NativeSelect.Root>
            <NativeSelect.Field {...register('band')}>
              {!known(
                observatory.bands.map((b) => b.name),
                values.band,
              ) && <option value={values.band}>{values.band} (not found)</option>}
              {observatory.bands.map((b) => (
                <option key={b.id} value={b.name}>
                  {b.name} ({formatNumber(b.minGHz)}–{formatNumber(b.maxGHz)} GHz)
                </option>
              ))}
            </NativeSelect.Field>
            <NativeSelect.Indicator />
          </NativeSelect.Root>
        </FormField>
      </SimpleGrid>
    </>
  );
}

function CustomSetupFields({ register, errors }: CalculatorFormProps) {
  const field = (name: FieldName) => (
    <QuantityField
      key={name}
      name={name}
      label={FIELD_LABELS[name]}
      register={register}
      error={errors[name]}
    />
  );
  return (
    <Stack gap="4">
      <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
        {field('antennas')}
        {field('dishDiameterM')}
        {field('latitudeDeg')}
        {field('longitudeDeg')}
        {field('elevationLimitDeg')}
        {field('correlatorEfficiency')}
        {field('overheadPercent')}
        {field('beamFactor')}
        {field('shortestBaselineM')}
        {field('longestBaselineM')}
        {field('bandMinGHz')}
        {field('bandMaxGHz')}
        {field('tsysK')}
        {field('apertureEfficiency')}
        {field('maxBandwidthMHz')}
      </SimpleGrid>
    </Stack>
  );
}

/** The lines most asked for, to fill in the rest frequency. */
const KNOWN_LINES = [
  { label: 'H I 21 cm', ghz: HI_REST_FREQUENCY_GHZ },
  { label: 'CO 1–0', ghz: CO_1_0_REST_FREQUENCY_GHZ },
] as const;

function restText(ghz: number, unit: CalculatorValues['restUnit']): string {
  return String(Number((unit === 'MHz' ? ghz * 1000 : ghz).toPrecision(13)));
}

export function CalculatorForm(props: CalculatorFormProps) {
  const { values, control, register, setValue, errors, stored } = props;
  return (
    <Stack gap="6">
      <Section legend="Array and receiver">
        <ChoiceGroup
          name="setup"
          control={control}
          label={FIELD_LABELS.setup}
          options={[
            { value: 'stored', label: 'Stored configurations' },
            { value: 'custom', label: 'Custom values' },
          ]}
          onChoose={(choice) => {
            if (choice === 'custom' && stored.observatory) {
              copyStored(stored.observatory, values, setValue);
            }
          }}
        />
        {values.setup === 'stored' ? (
          <StoredSetupFields {...props} />
        ) : (
          <CustomSetupFields {...props} />
        )}
      </Section>

      <Section legend="Frequency">
        <ChoiceGroup
          name="frequencyMode"
          control={control}
          label={FIELD_LABELS.frequencyMode}
          options={[
            { value: 'sky', label: 'Sky frequency' },
            { value: 'line', label: 'A spectral line' },
          ]}
        />
        {values.frequencyMode === 'sky' ? (
          <QuantityField
            name="frequency"
            label={FIELD_LABELS.frequency}
            register={register}
            error={errors.frequency}
            unit={{ ...frequencyUnit, name: 'frequencyUnit', label: FIELD_LABELS.frequencyUnit }}
          />
        ) : (
          <>
            <QuantityField
              name="restFrequency"
              label={FIELD_LABELS.restFrequency}
              register={register}
              error={errors.restFrequency}
              unit={{ ...frequencyUnit, name: 'restUnit', label: FIELD_LABELS.restUnit }}
              helperText={
                <HStack as="span" gap="2" wrap="wrap">
                  <span>Fill in:</span>
                  {KNOWN_LINES.map((line) => (
                    <Button
                      key={line.label}
                      size="2xs"
                      variant="outline"
                      onClick={() =>
                        setValue('restFrequency', restText(line.ghz, values.restUnit), {
                          shouldDirty: true,
                        })
                      }
                    >
                      {line.label}
                    </Button>
                  ))}
                </HStack>
              }
            />
            <ChoiceGroup
              name="shift"
              control={control}
              label={FIELD_LABELS.shift}
              options={[
                { value: 'velocity', label: 'Velocity' },
                { value: 'redshift', label: 'Redshift' },
              ]}
            />
            {values.shift === 'velocity' ? (
              <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
                <QuantityField
                  name="velocity"
                  label={FIELD_LABELS.velocity}
                  register={register}
                  error={errors.velocity}
                />
                <FormField label={FIELD_LABELS.convention} error={errors.convention}>
                  <NativeSelect.Root>
                    <NativeSelect.Field {...register('convention')}>
                      {CONVENTIONS.map((c) => (
                        <option key={c} value={c}>
                          {c}
                        </option>
                      ))}
                    </NativeSelect.Field>
                    <NativeSelect.Indicator />
                  </NativeSelect.Root>
                </FormField>
              </SimpleGrid>
            ) : (
              <QuantityField
                name="redshift"
                label={FIELD_LABELS.redshift}
                register={register}
                error={errors.redshift}
              />
            )}
          </>
        )}
        <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
          <QuantityField
            name="bandwidthMHz"
            label={FIELD_LABELS.bandwidthMHz}
            register={register}
            error={errors.bandwidthMHz}
          />
          <FormField label={FIELD_LABELS.polarizations} error={errors.polarizations}>
            <NativeSelect.Root>
              <NativeSelect.Field {...register('polarizations')}>
                <option value="2">2 (dual)</option>
                <option value="1">1 (single)</option>
              </NativeSelect.Field>
              <NativeSelect.Indicator />
            </NativeSelect.Root>
          </FormField>
        </SimpleGrid>
      </Section>

      <Section legend="Target">
        <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
          <QuantityField
            name="ra"
            label={FIELD_LABELS.ra}
            register={register}
            error={errors.ra}
            inputMode="text"
            helperText="10:00:24.0, 10h00m24s or degrees"
          />
          <QuantityField
            name="dec"
            label={FIELD_LABELS.dec}
            register={register}
            error={errors.dec}
            inputMode="text"
            helperText="+22:30:00, 22d30m00s or degrees"
          />
          <QuantityField
            name="extent"
            label={FIELD_LABELS.extent}
            register={register}
            error={errors.extent}
            helperText="Diameter to image; 0 for a point source"
            unit={{ ...angleUnit, name: 'extentUnit', label: FIELD_LABELS.extentUnit }}
          />
          <QuantityField
            name="resolutionGoal"
            label={FIELD_LABELS.resolutionGoal}
            register={register}
            error={errors.resolutionGoal}
            helperText="Optional"
            unit={{ ...angleUnit, name: 'resolutionUnit', label: FIELD_LABELS.resolutionUnit }}
          />
        </SimpleGrid>
      </Section>

      <Section legend="Sensitivity and time">
        <SimpleGrid columns={{ base: 1, sm: 2 }} gap="4">
          <QuantityField
            name="rmsGoal"
            label={FIELD_LABELS.rmsGoal}
            register={register}
            error={errors.rmsGoal}
            helperText="Optional"
            unit={{ name: 'rmsUnit', label: FIELD_LABELS.rmsUnit, options: FLUX_UNITS }}
          />
          <QuantityField
            name="time"
            label={FIELD_LABELS.time}
            register={register}
            error={errors.time}
            helperText="Optional"
            unit={{ name: 'timeUnit', label: FIELD_LABELS.timeUnit, options: TIME_UNITS }}
          />
        </SimpleGrid>
      </Section>
    </Stack>
  );
}
