import { angularSeparationDeg, primaryBeamArcmin, wavelengthM } from '@skyhours/calc';

/** One target of a proposal with the widest primary beam any of its observations is made with. */
export interface BeamTarget {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
  primaryBeamArcmin: number;
}

export interface ProposalBeams {
  id: string;
  reference: string;
  title: string;
  targets: BeamTarget[];
}

/** A target of this proposal that lies within the primary beam of a target of another proposal. */
export interface Overlap {
  targetId: string;
  targetName: string;
  otherReference: string;
  otherTitle: string;
  otherTargetName: string;
  separationArcmin: number;
  /** The wider of the two targets' primary beams (FWHM), the one the separation is held against. */
  primaryBeamArcmin: number;
  message: string;
}

const ARCMIN_PER_DEG = 60;

/** Primary-beam FWHM in arcmin of a dish at a sky frequency (libs/calc primaryBeamArcmin, 1.13 λ/D). */
export const beamAtArcmin = (frequencyGHz: number, dishDiameterM: number): number =>
  primaryBeamArcmin({
    wavelengthM: wavelengthM({ frequencyHz: frequencyGHz * 1e9 }),
    dishDiameterM,
  });

const arcmin = (value: number) =>
  value >= 10 ? value.toFixed(0) : value >= 0.1 ? value.toFixed(1) : value.toFixed(2);

/**
 * Overlap warnings per proposal id: two targets of different proposals overlap when one lies
 * inside the other's primary beam, i.e. their separation is at most half the wider FWHM (the
 * half-power radius). Targets of the same proposal never warn. Every proposal of the call is
 * compared with every other in memory: a call holds tens of proposals, so the pairs stay few.
 */
export function findOverlaps(proposals: readonly ProposalBeams[]): Map<string, Overlap[]> {
  const found = new Map<string, Overlap[]>(proposals.map((p) => [p.id, []]));
  for (let i = 0; i < proposals.length; i++) {
    const a = proposals[i]!;
    for (let j = i + 1; j < proposals.length; j++) {
      const b = proposals[j]!;
      for (const ta of a.targets)
        for (const tb of b.targets) {
          const separationArcmin = angularSeparationDeg(ta, tb) * ARCMIN_PER_DEG;
          const beam = Math.max(ta.primaryBeamArcmin, tb.primaryBeamArcmin);
          if (separationArcmin > beam / 2) continue;
          const note = (mine: BeamTarget, other: BeamTarget, otherProposal: ProposalBeams) => ({
            targetId: mine.id,
            targetName: mine.name,
            otherReference: otherProposal.reference,
            otherTitle: otherProposal.title,
            otherTargetName: other.name,
            separationArcmin,
            primaryBeamArcmin: beam,
            message: `${mine.name} lies ${arcmin(separationArcmin)}′ from ${other.name} of ${otherProposal.reference}, within the ${arcmin(beam)}′ primary beam.`,
          });
          found.get(a.id)!.push(note(ta, tb, b));
          found.get(b.id)!.push(note(tb, ta, a));
        }
    }
  }
  for (const list of found.values()) list.sort((x, y) => x.separationArcmin - y.separationArcmin);
  return found;
}
