import { Box, Card, Grid, Heading, Link, List, Stack } from '@chakra-ui/react';
import { useDeferredValue, useEffect, useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { useSearchParams } from 'react-router-dom';
import { BlockLoader } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { StatusIndicator } from '@/components/ui/status-indicator';
import { defineRoute } from '@/lib/route-module';
import { observatoriesQueryOptions, type StoredObservatory } from '../api';
import { calculate, fieldOfPath, parseNumber, toGHz, type Calculation } from '../calculate';
import { CalculatorForm } from '../components/calculator-form';
import { ChecksList } from '../components/checks-list';
import { CopyLinkButton } from '../components/copy-link-button';
import { Plots } from '../components/plots';
import { ResultsTable } from '../components/results-table';
import {
  FIELD_LABELS,
  valuesFromSearch,
  type CalculatorValues,
  type FieldName,
} from '../form-values';
import { linkTo, useStoredObservatory, useStoredSetup, useValuesInAddress } from '../hooks';

const today = () => new Date().toISOString().slice(0, 10);

/** The configuration in use today, else the first. */
function defaultConfiguration(observatory: StoredObservatory): string {
  const now = today();
  const inUse = observatory.configurations.find(
    (c) => c.inUseFrom <= now && (c.inUseTo === null || now <= c.inUseTo),
  );
  return (inUse ?? observatory.configurations[0])?.name ?? '';
}

/** The band that holds the sky frequency typed, else the first. */
function defaultBand(observatory: StoredObservatory, values: CalculatorValues): string {
  const typed = parseNumber(values.frequency);
  const ghz =
    values.frequencyMode === 'sky' && typeof typed === 'number'
      ? toGHz[values.frequencyUnit](typed)
      : null;
  const holding = observatory.bands.find((b) => ghz !== null && b.minGHz <= ghz && ghz <= b.maxGHz);
  return (holding ?? observatory.bands[0])?.name ?? '';
}

function Results({
  calculation,
  values,
  focusField,
}: {
  calculation: Calculation;
  values: CalculatorValues;
  focusField: (field: FieldName) => void;
}) {
  // The plots redraw hundreds of points: they may lag a keystroke behind, the fields must not.
  const forPlots = useDeferredValue(calculation);
  if (calculation.status === 'waiting') {
    return <BlockLoader label="Waiting for the observatory’s records" lines={8} />;
  }
  if (calculation.status === 'invalid') {
    const fields = Object.entries(calculation.errors) as [FieldName, string][];
    return (
      <Stack gap="3" role="status">
        <StatusIndicator tone="warning">
          {fields.length === 1
            ? 'One field needs a change before the numbers can be computed:'
            : `${fields.length || 'Some'} fields need a change before the numbers can be computed:`}
        </StatusIndicator>
        <List.Root ps="5" gap="1" textStyle="sm">
          {fields.map(([field, message]) => (
            <List.Item key={field}>
              <Link as="button" onClick={() => focusField(field)} fontWeight="medium">
                {FIELD_LABELS[field]}
              </Link>
              : {message}
            </List.Item>
          ))}
          {calculation.others.map((message) => (
            <List.Item key={message}>{message}</List.Item>
          ))}
        </List.Root>
      </Stack>
    );
  }
  return (
    <Stack gap="8">
      <ResultsTable result={calculation.result} values={values} />
      <Box as="section" aria-labelledby="checks-heading">
        <Heading as="h3" size="md" id="checks-heading" mb="3">
          Checks
        </Heading>
        <ChecksList
          checks={calculation.result.checks}
          fieldLabel={(path) => {
            const field = fieldOfPath(path, values.setup);
            return field ? FIELD_LABELS[field] : null;
          }}
        />
      </Box>
      <Box as="section" aria-labelledby="plots-heading">
        <Heading as="h3" size="md" id="plots-heading" mb="3">
          Plots
        </Heading>
        {forPlots.status === 'ready' && <Plots input={forPlots.input} result={forPlots.result} />}
      </Box>
    </Stack>
  );
}

/**
 * The calculator on its own: every number updates as the user types, computed in the browser by
 * the same library the server checks proposals with; the address holds the whole state.
 */
function CalculatorPage() {
  const [searchParams] = useSearchParams();
  // The address is read once: from then on the form leads and the address follows it.
  const [initialValues] = useState(() => valuesFromSearch(searchParams));
  const { control, register, setValue, getValues, setFocus } = useForm<CalculatorValues>({
    defaultValues: initialValues,
  });
  const values = useWatch({ control }) as CalculatorValues;
  const stored = useStoredObservatory();

  // Fill in a configuration and a band once the records come, unless the link named them.
  useEffect(() => {
    const observatory = stored.observatory;
    if (!observatory) return;
    if (getValues('configuration') === '') {
      setValue('configuration', defaultConfiguration(observatory));
    }
    if (getValues('band') === '') setValue('band', defaultBand(observatory, getValues()));
  }, [stored.observatory, getValues, setValue]);

  const setup = useStoredSetup(stored.observatory, values.configuration, values.band);
  const calculation = useMemo(() => calculate(values, setup), [values, setup]);
  useValuesInAddress(values);
  const errors = calculation.status === 'invalid' ? calculation.errors : {};

  return (
    <>
      <PageHeader
        title="Calculator"
        description="Resolution, sensitivity and visibility of one observation, computed as you type. The link holds everything you entered."
        actions={<CopyLinkButton link={() => linkTo(getValues())} />}
      />
      <Grid
        templateColumns={{ base: 'minmax(0, 1fr)', lg: 'minmax(0, 5fr) minmax(0, 6fr)' }}
        gap={{ base: '8', lg: '10' }}
        alignItems="start"
      >
        {/* Nothing to submit: the numbers follow the fields. */}
        <form aria-label="Observation" noValidate onSubmit={(event) => event.preventDefault()}>
          <CalculatorForm
            values={values}
            control={control}
            register={register}
            setValue={setValue}
            errors={errors}
            stored={stored}
          />
        </form>
        <Card.Root as="section" aria-labelledby="results-heading" variant="outline">
          <Card.Body>
            <Heading as="h2" size="lg" id="results-heading" mb="4">
              Results
            </Heading>
            <Results calculation={calculation} values={values} focusField={setFocus} />
          </Card.Body>
        </Card.Root>
      </Grid>
    </>
  );
}

export const route = defineRoute({
  Component: CalculatorPage,
  // Start loading the stored setup with the navigation, without waiting for it: the
  // Calculator works with custom values even when the API is away.
  loader: (queryClient) => () => {
    void queryClient.prefetchQuery(observatoriesQueryOptions());
    return null;
  },
});
