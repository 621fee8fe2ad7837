import type { ProposalKind } from '../calls/call-lifecycle.js';

/** Skyhours' own list of science categories; a proposal names one. */
export const SCIENCE_CATEGORIES = [
  'Cosmology and distant galaxies',
  'Nearby galaxies',
  'Active galaxies and jets',
  'Gas and dust in the Milky Way',
  'Star and planet formation',
  'Stars and stellar remnants',
  'Pulsars and fast transients',
  'Solar system',
  'Magnetic fields',
  'Techniques and surveys',
] as const;

export const KIND_LABELS: Record<ProposalKind, string> = {
  standard: 'Standard',
  large: 'Large',
  target_of_opportunity: 'Target of opportunity',
  discretionary: "Director's discretionary time",
};

export const ABSTRACT_WORD_LIMIT = 300;

/** Words as a reader counts them: runs of non-space characters. */
export function countWords(text: string): number {
  const trimmed = text.trim();
  return trimmed === '' ? 0 : trimmed.split(/\s+/u).length;
}
