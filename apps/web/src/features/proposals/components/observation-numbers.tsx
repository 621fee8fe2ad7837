import { Table, Text } from '@chakra-ui/react';
import type { ObservationResult } from '@skyhours/calc';
import { formatLst, formatNumber } from '../format';

export interface ObservationNumbersProps {
  result: ObservationResult;
  /** On-source hours per pointing bought by the hours asked; null without hours. */
  onSourceHours: number | null;
  /** Total hours the rms goal needs; null without a goal. */
  hoursForGoal: number | null;
  rmsGoalMicroJy: number | null;
  /** Names the table: "Live preview" or "Stored with the observation". */
  caption: string;
}

/**
 * The calculator's numbers for one observation, each row marked with `data-quantity` so that
 * tests (and people) find the same number in the same place.
 */
export function ObservationNumbers({
  result,
  onSourceHours,
  hoursForGoal,
  rmsGoalMicroJy,
  caption,
}: ObservationNumbersProps) {
  const rows: [string, string, string][] = [
    ['sky-frequency', 'Sky frequency', `${formatNumber(result.skyFrequencyGHz, 6)} GHz`],
    ['wavelength', 'Wavelength', `${formatNumber(result.wavelengthM * 100, 4)} cm`],
    ['resolution', 'Angular resolution', `${formatNumber(result.resolutionArcsec)}″`],
    ['largest-scale', 'Largest angular scale', `${formatNumber(result.largestScaleArcsec)}″`],
    ['primary-beam', 'Primary beam', `${formatNumber(result.primaryBeamArcmin)}′`],
    ['pointings', 'Pointings', String(result.pointings)],
    ['sefd', 'SEFD', `${formatNumber(result.sefdJy)} Jy`],
    [
      'on-source',
      'On-source time per pointing',
      onSourceHours === null ? '—' : `${formatNumber(onSourceHours)} h`,
    ],
    [
      'rms',
      'Rms reached',
      result.rmsMicroJy === null
        ? '— (give the hours asked)'
        : `${formatNumber(result.rmsMicroJy)} µJy${
            rmsGoalMicroJy === null ? '' : ` (goal ${formatNumber(rmsGoalMicroJy)} µJy)`
          }`,
    ],
    [
      'hours-for-goal',
      'Hours the goal needs',
      hoursForGoal === null ? '— (no rms goal)' : `${formatNumber(hoursForGoal)} h`,
    ],
    [
      'brightness-rms',
      'Brightness rms in the beam',
      result.brightnessRmsK === null ? '—' : `${formatNumber(result.brightnessRmsK)} K`,
    ],
    ['max-elevation', 'Highest elevation', `${formatNumber(result.maxElevationDeg)}°`],
    [
      'hours-above-limit',
      'Hours above the elevation limit',
      `${formatNumber(result.hoursAboveLimit)} h`,
    ],
    [
      'lst-window',
      'LST window',
      result.lstRiseHours === null || result.lstSetHours === null
        ? result.hoursAboveLimit > 0
          ? 'always up'
          : 'never up'
        : `${formatLst(result.lstRiseHours)} – ${formatLst(result.lstSetHours)}`,
    ],
  ];
  return (
    <Table.Root size="sm" variant="outline" rounded="md">
      <Table.Caption captionSide="top" textAlign="start" mb="2">
        <Text fontWeight="semibold" color="fg">
          {caption}
        </Text>
      </Table.Caption>
      <Table.Body>
        {rows.map(([id, label, value]) => (
          <Table.Row key={id}>
            <Table.ColumnHeader scope="row" fontWeight="normal" color="fg.muted">
              {label}
            </Table.ColumnHeader>
            <Table.Cell data-quantity={id} textAlign="end" fontVariantNumeric="tabular-nums">
              {value}
            </Table.Cell>
          </Table.Row>
        ))}
      </Table.Body>
    </Table.Root>
  );
}
