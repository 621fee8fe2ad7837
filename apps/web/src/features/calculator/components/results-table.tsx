import { Table, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import type { ObservationResult } from '@skyhours/calc';
import { fromArcsec, fromHours, fromMicroJy } from '../calculate';
import { formatLst, formatNumber } from '../format';
import { UNIT_LABELS, type CalculatorValues } from '../form-values';

interface Row {
  label: string;
  /** How it is computed, in a few symbols. */
  basis?: ReactNode;
  value: string;
  unit: string;
  /** Why there is no value. */
  missing?: string;
}

/** `x` converted to the unit shown; null stays null (the row then says why). */
const inUnit = (x: number | null, convert: (x: number) => number) =>
  x === null ? null : convert(x);

function rows(result: ObservationResult, values: CalculatorValues): Row[] {
  const angle = values.resolutionUnit;
  const time = values.timeUnit;
  const flux = values.rmsUnit;
  const number = (x: number | null, digits = 4) => (x === null ? '—' : formatNumber(x, digits));
  const window =
    result.lstRiseHours !== null && result.lstSetHours !== null
      ? `${formatLst(result.lstRiseHours)} – ${formatLst(result.lstSetHours)}`
      : result.hoursAboveLimit >= 24
        ? 'always up'
        : 'never up';
  return [
    { label: 'Sky frequency', value: number(result.skyFrequencyGHz, 7), unit: 'GHz' },
    { label: 'Wavelength', basis: 'c / ν', value: number(result.wavelengthM * 100), unit: 'cm' },
    {
      label: 'Angular resolution',
      basis: 'λ / longest baseline',
      value: number(inUnit(result.resolutionArcsec, fromArcsec[angle])),
      unit: UNIT_LABELS[angle],
    },
    {
      label: 'Largest angular scale',
      basis: '0.6 λ / shortest baseline',
      value: number(inUnit(result.largestScaleArcsec, fromArcsec[angle])),
      unit: UNIT_LABELS[angle],
    },
    {
      label: 'Primary beam (field of view)',
      basis: 'factor × λ / D',
      value: number(result.primaryBeamArcmin),
      unit: 'arcmin',
    },
    {
      label: 'Pointings',
      basis: 'mosaic for the extent',
      value: String(result.pointings),
      unit: '',
    },
    {
      label: 'Effective area of a dish',
      basis: (
        <>
          η<sub>a</sub> π D² / 4
        </>
      ),
      value: number(result.effectiveAreaM2),
      unit: 'm²',
    },
    {
      label: 'SEFD',
      basis: (
        <>
          2 k T<sub>sys</sub> / A<sub>eff</sub>
        </>
      ),
      value: number(result.sefdJy),
      unit: 'Jy',
    },
    {
      label: 'Image rms in the time on source',
      value: number(inUnit(result.rmsMicroJy, fromMicroJy[flux])),
      unit: `${UNIT_LABELS[flux]}/beam`,
      missing: result.rmsMicroJy === null ? 'give a time on source' : undefined,
    },
    {
      label: 'Time on source for the rms goal',
      basis: 'per pointing',
      value: number(inUnit(result.onSourceHoursForGoal, fromHours[time])),
      unit: UNIT_LABELS[time],
      missing: result.onSourceHoursForGoal === null ? 'give an rms goal' : undefined,
    },
    {
      label: 'Total time',
      basis: 'on source × pointings × (1 + overhead)',
      value: number(inUnit(result.totalHours, fromHours[time])),
      unit: UNIT_LABELS[time],
      missing: result.totalHours === null ? 'give a time or an rms goal' : undefined,
    },
    {
      label: 'Brightness-temperature rms',
      basis: 'in the synthesised beam',
      value: number(result.brightnessRmsK),
      unit: 'K',
      missing: result.brightnessRmsK === null ? 'give a time or an rms goal' : undefined,
    },
    { label: 'Highest elevation', value: number(result.maxElevationDeg, 3), unit: '°' },
    {
      label: 'Time above the elevation limit',
      basis: 'per sidereal day',
      value: number(result.hoursAboveLimit, 3),
      unit: 'hours',
    },
    { label: 'LST window', basis: 'rise – set at the limit', value: window, unit: '' },
  ];
}

/** Every number of the calculation, with its unit and, where it helps, how it comes about. */
export function ResultsTable({
  result,
  values,
}: {
  result: ObservationResult;
  values: CalculatorValues;
}) {
  return (
    <Table.Root size="sm" variant="line" aria-labelledby="results-heading">
      <Table.Header>
        <Table.Row>
          <Table.ColumnHeader>Quantity</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">Value</Table.ColumnHeader>
          <Table.ColumnHeader>Unit</Table.ColumnHeader>
        </Table.Row>
      </Table.Header>
      <Table.Body>
        {rows(result, values).map((row) => (
          <Table.Row key={row.label}>
            <Table.Cell>
              <Text as="span" display="block">
                {row.label}
              </Text>
              {row.basis && (
                <Text as="span" display="block" textStyle="xs" color="fg.muted">
                  {row.basis}
                </Text>
              )}
            </Table.Cell>
            <Table.Cell
              textAlign="end"
              fontVariantNumeric="tabular-nums"
              fontWeight="medium"
              data-quantity={row.label}
            >
              {row.value}
              {row.missing && (
                <Text as="span" display="block" textStyle="xs" color="fg.muted" fontWeight="normal">
                  {row.missing}
                </Text>
              )}
            </Table.Cell>
            <Table.Cell color="fg.muted">{row.unit}</Table.Cell>
          </Table.Row>
        ))}
      </Table.Body>
    </Table.Root>
  );
}
