import {
  CoordinateParseError,
  parseDeclination,
  parseRightAscension,
  type VelocityConvention,
} from '@skyhours/calc';
import type { FieldIssue } from '../common/errors/app-error.js';

export const CONVENTIONS: readonly VelocityConvention[] = ['radio', 'optical', 'relativistic'];
/** The speed of light in km/s (SI, exact). */
const C_KM_S = 299_792.458;
const MAX_EXTENT_ARCSEC = 648_000;
const MAX_REST_GHZ = 1e5;

/** A target as typed: coordinates as text, the rest as numbers (null: not given). */
export interface TargetFields {
  name: string;
  ra: string;
  dec: string;
  extentArcsec: number | null;
  fluxDensityMJy: number | null;
  restGHz: number | null;
  velocityKmS: number | null;
  convention: string | null;
  redshift: number | null;
}
export type TargetField = keyof TargetFields;

/** The columns of a stored target. */
export interface TargetColumns {
  name: string;
  raDeg: number;
  decDeg: number;
  extentArcsec: number;
  fluxDensityMJy: number | null;
  lineRestGHz: number | null;
  lineVelocityKmS: number | null;
  lineConvention: VelocityConvention | null;
  lineRedshift: number | null;
}

/**
 * Checks and converts a target, for the form and for each row of a CSV import alike. `path` names
 * a field as the caller's request does (`line.restGHz` in the form, `rest_ghz` in the CSV).
 * Coordinates go through the calculator library's parsers (sexagesimal or decimal degrees).
 */
export function parseTarget(
  f: TargetFields,
  path: (field: TargetField) => string,
): { values: TargetColumns | null; read: Partial<TargetColumns>; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const bad = (field: TargetField, message: string) => issues.push({ path: path(field), message });

  const name = f.name.trim();
  if (name === '') bad('name', 'name is required');
  else if (name.length > 100) bad('name', 'name must be at most 100 characters');

  const coordinate = (field: 'ra' | 'dec', parse: (text: string) => number): number | null => {
    if (f[field].trim() === '') {
      bad(field, `${field} is required`);
      return null;
    }
    try {
      return parse(f[field]);
    } catch (error) {
      if (error instanceof CoordinateParseError) {
        bad(field, error.message);
        return null;
      }
      throw error;
    }
  };
  const raDeg = coordinate('ra', parseRightAscension);
  const decDeg = coordinate('dec', parseDeclination);

  const extent = f.extentArcsec ?? 0;
  if (!(extent >= 0 && extent <= MAX_EXTENT_ARCSEC))
    bad('extentArcsec', `extent must be from 0 to ${MAX_EXTENT_ARCSEC} arcsec`);
  if (f.fluxDensityMJy !== null && !(f.fluxDensityMJy >= 0))
    bad('fluxDensityMJy', 'flux density must be 0 mJy or more');

  const { restGHz, velocityKmS, redshift } = f;
  const convention = f.convention === null ? null : f.convention.trim().toLowerCase();
  if (restGHz === null) {
    if (velocityKmS !== null) bad('velocityKmS', 'a velocity needs the line’s rest frequency');
    if (redshift !== null) bad('redshift', 'a redshift needs the line’s rest frequency');
    if (convention !== null) bad('convention', 'a convention needs the line’s rest frequency');
  } else {
    if (!(restGHz > 0 && restGHz <= MAX_REST_GHZ))
      bad('restGHz', `rest frequency must be above 0 and at most ${MAX_REST_GHZ} GHz`);
    if (velocityKmS !== null && redshift !== null)
      bad('redshift', 'give a velocity or a redshift, not both');
    else if (velocityKmS === null && redshift === null)
      bad('velocityKmS', 'a line needs a velocity (with its convention) or a redshift');
    if (velocityKmS !== null) {
      if (!(Math.abs(velocityKmS) < C_KM_S))
        bad('velocityKmS', `velocity must be below the speed of light (${C_KM_S} km/s)`);
      if (convention === null)
        bad('convention', 'a velocity needs its convention: radio, optical or relativistic');
    }
    if (convention !== null && !CONVENTIONS.includes(convention as VelocityConvention))
      bad('convention', 'convention must be radio, optical or relativistic');
    else if (redshift !== null && convention !== null && velocityKmS === null)
      bad('convention', 'a redshift needs no convention');
    if (redshift !== null && !(redshift > -1)) bad('redshift', 'redshift must be above −1');
  }

  const withVelocity = restGHz !== null && velocityKmS !== null;
  const read = {
    name,
    raDeg,
    decDeg,
    extentArcsec: extent,
    fluxDensityMJy: f.fluxDensityMJy,
    lineRestGHz: restGHz,
    lineVelocityKmS: withVelocity ? velocityKmS : null,
    lineConvention: withVelocity ? (convention as VelocityConvention) : null,
    lineRedshift: restGHz !== null && !withVelocity ? redshift : null,
  };
  // What could be read is shown even beside errors (the import's preview).
  const partial: Partial<TargetColumns> = Object.fromEntries(
    Object.entries(read).filter(([, v]) => v !== null),
  );
  if (issues.length > 0 || raDeg === null || decDeg === null)
    return { values: null, read: partial, issues };
  return { values: { ...read, raDeg, decDeg }, read: partial, issues };
}
