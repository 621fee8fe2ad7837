/**
 * The Calculator's two plots. This module holds the chart package and is loaded lazily, so the
 * page's first load stays small (see plots.tsx).
 */
import { Box, Heading, HStack, NativeSelect, Stack, Text } from '@chakra-ui/react';
import {
  ARCSEC_PER_RAD,
  DEFAULT_BEAM_FACTOR,
  SPEED_OF_LIGHT_M_PER_S,
  elevationCurve,
  fringeResponse,
  type ObservationInput,
  type ObservationResult,
} from '@skyhours/calc';
import { useId, useMemo, useState } from 'react';
import {
  CartesianGrid,
  Line,
  LineChart,
  ReferenceArea,
  ReferenceLine,
  XAxis,
  YAxis,
} from 'recharts';
import { formatLst, formatNumber } from '../format';

export interface ChartsProps {
  input: ObservationInput;
  result: ObservationResult;
}

const HEIGHT = 260;
// Chakra's semantic tokens as CSS variables, so the plots follow light and dark mode.
const color = {
  line: 'var(--chakra-colors-brand-solid)',
  envelope: 'var(--chakra-colors-fg-muted)',
  grid: 'var(--chakra-colors-border)',
  axis: 'var(--chakra-colors-fg-muted)',
  target: 'var(--chakra-colors-note-solid)',
  up: 'var(--chakra-colors-success-solid)',
  limit: 'var(--chakra-colors-warning-solid)',
};
const axisStyle = { fontSize: 12, fill: color.axis };
const axisLabel = (value: string, angle = 0) => ({
  value,
  angle,
  position: angle === 0 ? ('insideBottom' as const) : ('insideLeft' as const),
  offset: angle === 0 ? -4 : 4,
  style: { ...axisStyle, textAnchor: 'middle' as const },
});

function Figure({
  title,
  description,
  controls,
  children,
}: {
  title: string;
  description: string;
  controls?: React.ReactNode;
  children: React.ReactNode;
}) {
  const id = useId();
  return (
    <Box
      as="figure"
      role="group"
      aria-labelledby={`${id}-title`}
      aria-describedby={`${id}-desc`}
      m="0"
    >
      <HStack justify="space-between" align="end" wrap="wrap" gap="2" mb="2">
        <Heading as="h3" size="sm" id={`${id}-title`}>
          {title}
        </Heading>
        {controls}
      </HStack>
      <Box aria-hidden>{children}</Box>
      <Text as="figcaption" id={`${id}-desc`} textStyle="sm" color="fg.muted" mt="2">
        {description}
      </Text>
    </Box>
  );
}

type FringeView = 'centre' | 'beam';

/** Round-number ticks from −limit to +limit through 0, five to nine of them. */
function symmetricTicks(limit: number): number[] {
  const rough = limit / 3;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * power >= rough) ?? 10) * power;
  const count = Math.floor(limit / step + 1e-9);
  return Array.from({ length: 2 * count + 1 }, (_, i) => (i - count) * step);
}

function FringeChart({ input, result }: ChartsProps) {
  const [view, setView] = useState<FringeView>('centre');
  const beamFactor = input.array.beamFactor ?? DEFAULT_BEAM_FACTOR;
  const extent = input.target.extentArcsec;
  // The range is fixed by the band's lowest frequency (its widest beam and fringes), not by
  // the frequency typed: both λ/B and λ/D scale with λ, so a range in units of them would draw
  // the same picture at every frequency, and a change of frequency would not show.
  const widestM =
    SPEED_OF_LIGHT_M_PER_S / (Math.min(result.skyFrequencyGHz, input.band.minGHz) * 1e9);
  const widestBeamArcsec = ((beamFactor * widestM) / input.array.dishDiameterM) * ARCSEC_PER_RAD;
  const widestFringeArcsec = (widestM / input.configuration.longestBaselineM) * ARCSEC_PER_RAD;
  // Around the centre: a dozen fringes, widened to show the whole target; never past the beam.
  const halfWidth =
    view === 'beam'
      ? widestBeamArcsec
      : Math.min(widestBeamArcsec, Math.max(6 * widestFringeArcsec, 0.6 * extent));
  const inArcmin = halfWidth >= 300;
  const unit = inArcmin ? 'arcmin' : 'arcsec';
  const scale = inArcmin ? 1 / 60 : 1;

  const data = useMemo(
    () =>
      fringeResponse({
        wavelengthM: result.wavelengthM,
        longestBaselineM: input.configuration.longestBaselineM,
        dishDiameterM: input.array.dishDiameterM,
        beamFactor,
        halfWidthArcsec: halfWidth,
        // Enough points to draw every fringe across the chart, but a bounded number.
        samples: Math.min(
          2001,
          Math.max(201, 2 * Math.ceil((8 * halfWidth) / result.resolutionArcsec) + 1),
        ),
      }).map((p) => ({
        x: p.offsetArcsec * scale,
        response: p.response,
        envelope: p.envelope,
        below: -p.envelope,
      })),
    [result, input, beamFactor, halfWidth, scale],
  );

  const spacing = formatNumber(result.resolutionArcsec * scale, 3);
  const description =
    `The fringe of the ${formatNumber(input.configuration.longestBaselineM)} m longest baseline ` +
    `repeats every ${spacing} ${unit} (λ/B) under the primary beam of ` +
    `${formatNumber(result.primaryBeamArcmin, 3)} arcmin (dashed envelope). ` +
    (extent > 0
      ? `The shaded band is the target's extent of ${formatNumber(extent * scale, 3)} ${unit}.`
      : 'The target is a point at the centre.');

  return (
    <Figure
      title="Response across the sky"
      description={description}
      controls={
        <NativeSelect.Root size="xs" width="auto">
          <NativeSelect.Field
            aria-label="Range of the response plot"
            value={view}
            onChange={(event) => setView(event.currentTarget.value as FringeView)}
          >
            <option value="centre">Around the centre</option>
            <option value="beam">Whole primary beam</option>
          </NativeSelect.Field>
          <NativeSelect.Indicator />
        </NativeSelect.Root>
      }
    >
      <LineChart
        data={data}
        responsive
        style={{ width: '100%', height: HEIGHT }}
        margin={{ top: 8, right: 12, bottom: 20, left: 8 }}
        accessibilityLayer={false}
      >
        <CartesianGrid stroke={color.grid} strokeDasharray="2 4" />
        {extent > 0 && (
          <ReferenceArea
            x1={(-extent / 2) * scale}
            x2={(extent / 2) * scale}
            fill={color.target}
            fillOpacity={0.15}
            stroke={color.target}
            strokeOpacity={0.5}
            ifOverflow="hidden"
          />
        )}
        <XAxis
          dataKey="x"
          type="number"
          domain={[-halfWidth * scale, halfWidth * scale]}
          ticks={symmetricTicks(halfWidth * scale)}
          tick={axisStyle}
          tickFormatter={(x: number) => formatNumber(x, 3)}
          stroke={color.grid}
          label={axisLabel(`Offset from the pointing centre (${unit})`)}
          height={40}
        />
        <YAxis
          domain={[-1, 1]}
          ticks={[-1, -0.5, 0, 0.5, 1]}
          tick={axisStyle}
          tickFormatter={(y: number) => formatNumber(y, 2)}
          stroke={color.grid}
          label={axisLabel('Relative response', -90)}
          width={64}
        />
        <Line
          dataKey="envelope"
          stroke={color.envelope}
          strokeDasharray="5 4"
          dot={false}
          isAnimationActive={false}
        />
        <Line
          dataKey="below"
          stroke={color.envelope}
          strokeDasharray="5 4"
          dot={false}
          isAnimationActive={false}
        />
        <Line
          dataKey="response"
          stroke={color.line}
          strokeWidth={1.5}
          dot={false}
          isAnimationActive={false}
        />
      </LineChart>
    </Figure>
  );
}

/** The LST ranges, within 0–24 h, in which the target is above the limit. */
function upRanges(result: ObservationResult): [number, number][] {
  const { lstRiseHours: rise, lstSetHours: set } = result;
  if (rise === null || set === null) return result.hoursAboveLimit >= 24 ? [[0, 24]] : [];
  return rise < set
    ? [[rise, set]]
    : [
        [0, set],
        [rise, 24],
      ];
}

function ElevationChart({ input, result }: ChartsProps) {
  const limit = input.array.elevationLimitDeg;
  const data = useMemo(
    () =>
      elevationCurve({
        latitudeDeg: input.array.latitudeDeg,
        decDeg: input.target.decDeg,
        raDeg: input.target.raDeg,
      }),
    [input],
  );
  const lowest = Math.min(limit, ...data.map((p) => p.elevationDeg));
  const floor = Math.max(-90, Math.floor((lowest - 5) / 30) * 30);
  const ranges = upRanges(result);
  const description =
    ranges.length === 0
      ? `The target culminates at ${formatNumber(result.maxElevationDeg, 3)}°, below the elevation limit of ${formatNumber(limit, 3)}° (the line): it never rises above it.`
      : result.lstRiseHours === null
        ? `The target stays above the elevation limit of ${formatNumber(limit, 3)}° (the line) all sidereal day, culminating at ${formatNumber(result.maxElevationDeg, 3)}°.`
        : `The target is above the elevation limit of ${formatNumber(limit, 3)}° (the line) from ${formatLst(result.lstRiseHours)} to ${formatLst(result.lstSetHours ?? 0)} LST (shaded), ${formatNumber(result.hoursAboveLimit, 3)} hours, culminating at ${formatNumber(result.maxElevationDeg, 3)}°.`;

  return (
    <Figure title="Elevation through the sidereal day" description={description}>
      <LineChart
        data={data}
        responsive
        style={{ width: '100%', height: HEIGHT }}
        margin={{ top: 8, right: 12, bottom: 20, left: 8 }}
        accessibilityLayer={false}
      >
        <CartesianGrid stroke={color.grid} strokeDasharray="2 4" />
        {ranges.map(([from, to]) => (
          <ReferenceArea
            key={from}
            x1={from}
            x2={to}
            y1={limit}
            y2={90}
            fill={color.up}
            fillOpacity={0.15}
            ifOverflow="hidden"
          />
        ))}
        <XAxis
          dataKey="lstHours"
          type="number"
          domain={[0, 24]}
          ticks={[0, 3, 6, 9, 12, 15, 18, 21, 24]}
          tick={axisStyle}
          stroke={color.grid}
          label={axisLabel('Local sidereal time (hours)')}
          height={40}
        />
        <YAxis
          type="number"
          domain={[floor, 90]}
          ticks={Array.from(
            { length: Math.round((90 - floor) / 30) + 1 },
            (_, i) => floor + 30 * i,
          )}
          tick={axisStyle}
          tickFormatter={(y: number) => formatNumber(y, 2)}
          stroke={color.grid}
          label={axisLabel('Elevation (°)', -90)}
          width={64}
        />
        <ReferenceLine
          y={limit}
          stroke={color.limit}
          strokeWidth={1.5}
          strokeDasharray="6 3"
          label={{
            value: `limit ${formatNumber(limit, 3)}°`,
            position: 'insideBottomRight',
            style: { ...axisStyle, fill: color.limit },
          }}
        />
        <Line
          dataKey="elevationDeg"
          stroke={color.line}
          strokeWidth={2}
          dot={false}
          isAnimationActive={false}
        />
      </LineChart>
    </Figure>
  );
}

export default function CalculatorCharts(props: ChartsProps) {
  return (
    <Stack gap="8">
      <FringeChart {...props} />
      <ElevationChart {...props} />
    </Stack>
  );
}
