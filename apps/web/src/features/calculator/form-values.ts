/**
 * The Calculator's form: what the user typed, as text, with the unit chosen for each quantity.
 * The whole state lives in the address's search parameters too, so a link reproduces it.
 */

export const FREQUENCY_UNITS = ['GHz', 'MHz'] as const;
export const ANGLE_UNITS = ['arcsec', 'arcmin'] as const;
export const FLUX_UNITS = ['uJy', 'mJy'] as const;
export const TIME_UNITS = ['h', 'min'] as const;
export const CONVENTIONS = ['radio', 'optical', 'relativistic'] as const;

export type FrequencyUnit = (typeof FREQUENCY_UNITS)[number];
export type AngleUnit = (typeof ANGLE_UNITS)[number];
export type FluxUnit = (typeof FLUX_UNITS)[number];
export type TimeUnit = (typeof TIME_UNITS)[number];
export type Convention = (typeof CONVENTIONS)[number];

/** How each unit is written on screen (the address uses the plain ASCII value). */
export const UNIT_LABELS: Record<FrequencyUnit | AngleUnit | FluxUnit | TimeUnit, string> = {
  GHz: 'GHz',
  MHz: 'MHz',
  arcsec: 'arcsec',
  arcmin: 'arcmin',
  uJy: 'µJy',
  mJy: 'mJy',
  h: 'hours',
  min: 'minutes',
};

export interface CalculatorValues {
  /** The observatory's stored configuration and band, or numbers typed in. */
  setup: 'stored' | 'custom';
  /** Names of the stored configuration and band (names, not ids, so links outlive a reload). */
  configuration: string;
  band: string;

  // A custom array, configuration and band.
  antennas: string;
  dishDiameterM: string;
  latitudeDeg: string;
  longitudeDeg: string;
  elevationLimitDeg: string;
  correlatorEfficiency: string;
  overheadPercent: string;
  beamFactor: string;
  shortestBaselineM: string;
  longestBaselineM: string;
  bandMinGHz: string;
  bandMaxGHz: string;
  tsysK: string;
  apertureEfficiency: string;
  maxBandwidthMHz: string;

  // The observation.
  frequencyMode: 'sky' | 'line';
  frequency: string;
  frequencyUnit: FrequencyUnit;
  restFrequency: string;
  restUnit: FrequencyUnit;
  shift: 'velocity' | 'redshift';
  velocity: string;
  convention: Convention;
  redshift: string;
  bandwidthMHz: string;
  polarizations: '1' | '2';
  ra: string;
  dec: string;
  extent: string;
  extentUnit: AngleUnit;
  resolutionGoal: string;
  resolutionUnit: AngleUnit;
  rmsGoal: string;
  rmsUnit: FluxUnit;
  time: string;
  timeUnit: TimeUnit;
}

export type FieldName = keyof CalculatorValues;

/** Each field's label, the one name the form, the checks and the problem list use for it. */
export const FIELD_LABELS: Record<FieldName, string> = {
  setup: 'Array and receiver',
  configuration: 'Configuration',
  band: 'Receiver band',
  antennas: 'Antennas',
  dishDiameterM: 'Dish diameter (m)',
  latitudeDeg: 'Site latitude (°)',
  longitudeDeg: 'Site longitude (° east)',
  elevationLimitDeg: 'Elevation limit (°)',
  correlatorEfficiency: 'Correlator efficiency',
  overheadPercent: 'Calibration overhead (%)',
  beamFactor: 'Primary-beam factor (× λ/D)',
  shortestBaselineM: 'Shortest baseline (m)',
  longestBaselineM: 'Longest baseline (m)',
  bandMinGHz: 'Band from (GHz)',
  bandMaxGHz: 'Band to (GHz)',
  tsysK: 'System temperature (K)',
  apertureEfficiency: 'Aperture efficiency',
  maxBandwidthMHz: 'Widest bandwidth (MHz)',
  frequencyMode: 'Frequency given as',
  frequency: 'Sky frequency',
  frequencyUnit: 'Frequency unit',
  restFrequency: 'Rest frequency',
  restUnit: 'Rest frequency unit',
  shift: 'Shift given as',
  velocity: 'Velocity (km/s, receding > 0)',
  convention: 'Velocity convention',
  redshift: 'Redshift z',
  bandwidthMHz: 'Bandwidth (MHz)',
  polarizations: 'Polarisations',
  ra: 'Right ascension (ICRS)',
  dec: 'Declination (ICRS)',
  extent: 'Angular extent',
  extentUnit: 'Extent unit',
  resolutionGoal: 'Resolution needed',
  resolutionUnit: 'Resolution unit',
  rmsGoal: 'rms noise goal (per beam)',
  rmsUnit: 'rms unit',
  time: 'Time on source (per pointing)',
  timeUnit: 'Time unit',
};

/** A custom setup to start from: an invented array of 18 dishes of 16 m (SCIENCE.md's example). */
export const DEFAULT_CUSTOM = {
  antennas: '18',
  dishDiameterM: '16',
  latitudeDeg: '47.3',
  longitudeDeg: '-118.9',
  elevationLimitDeg: '15',
  correlatorEfficiency: '0.88',
  overheadPercent: '20',
  beamFactor: '1.13',
  shortestBaselineM: '30',
  longestBaselineM: '3200',
  bandMinGHz: '1',
  bandMaxGHz: '2',
  tsysK: '28',
  apertureEfficiency: '0.65',
  maxBandwidthMHz: '1000',
} satisfies Partial<CalculatorValues>;

export const DEFAULT_VALUES: CalculatorValues = {
  setup: 'stored',
  configuration: '',
  band: '',
  ...DEFAULT_CUSTOM,
  frequencyMode: 'sky',
  frequency: '1.4',
  frequencyUnit: 'GHz',
  restFrequency: '1420.405751768',
  restUnit: 'MHz',
  shift: 'velocity',
  velocity: '0',
  convention: 'radio',
  redshift: '0',
  bandwidthMHz: '500',
  polarizations: '2',
  ra: '10:00:24.0',
  dec: '+22:30:00',
  extent: '0',
  extentUnit: 'arcsec',
  resolutionGoal: '',
  resolutionUnit: 'arcsec',
  rmsGoal: '10',
  rmsUnit: 'uJy',
  time: '2',
  timeUnit: 'h',
};

const CHOICES: Partial<Record<FieldName, readonly string[]>> = {
  setup: ['stored', 'custom'],
  frequencyMode: ['sky', 'line'],
  frequencyUnit: FREQUENCY_UNITS,
  restUnit: FREQUENCY_UNITS,
  shift: ['velocity', 'redshift'],
  convention: CONVENTIONS,
  polarizations: ['1', '2'],
  extentUnit: ANGLE_UNITS,
  resolutionUnit: ANGLE_UNITS,
  rmsUnit: FLUX_UNITS,
  timeUnit: TIME_UNITS,
};

const CUSTOM_FIELDS = Object.keys(DEFAULT_CUSTOM) as FieldName[];

/** The fields that matter for these values, in the order they appear in a link. */
function relevantFields(values: CalculatorValues): FieldName[] {
  return [
    'setup',
    ...(values.setup === 'stored' ? (['configuration', 'band'] as const) : CUSTOM_FIELDS),
    'frequencyMode',
    ...(values.frequencyMode === 'sky'
      ? (['frequency', 'frequencyUnit'] as const)
      : (['restFrequency', 'restUnit', 'shift'] as const)),
    ...(values.frequencyMode === 'line'
      ? values.shift === 'velocity'
        ? (['velocity', 'convention'] as const)
        : (['redshift'] as const)
      : []),
    'bandwidthMHz',
    'polarizations',
    'ra',
    'dec',
    'extent',
    'extentUnit',
    'resolutionGoal',
    'resolutionUnit',
    'rmsGoal',
    'rmsUnit',
    'time',
    'timeUnit',
  ];
}

/** The search parameters of a link to these values; fields the mode does not use are left out. */
export function valuesToSearch(values: CalculatorValues): URLSearchParams {
  const params = new URLSearchParams();
  for (const field of relevantFields(values)) params.set(field, values[field]);
  return params;
}

/**
 * The values a link describes. A missing or unknown choice falls back to its default; text is
 * taken as it is (the form then shows what is wrong with it, as it would for typed text).
 */
export function valuesFromSearch(params: URLSearchParams): CalculatorValues {
  const values: Record<string, string> = { ...DEFAULT_VALUES };
  for (const field of Object.keys(DEFAULT_VALUES) as FieldName[]) {
    const text = params.get(field);
    if (text === null) continue;
    const choices = CHOICES[field];
    if (choices && !choices.includes(text)) continue;
    values[field] = text.slice(0, 200);
  }
  return values as unknown as CalculatorValues;
}
