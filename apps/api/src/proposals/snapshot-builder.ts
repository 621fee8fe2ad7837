import { observationChecks } from './proposal-checks.js';
import { type ProposalData, totalHoursAsked } from './proposal-data.js';
import type { ProposalSnapshot } from './proposal-snapshot.js';
import { targetLine } from './observation-calculation.js';

/** Hours to 1/1000 h, so sums of decimals compare and print cleanly. */
const round = (h: number) => Math.round(h * 1000) / 1000;

/**
 * Everything a submitted version freezes, from the proposal as it is in the submission's
 * transaction. Only members who have joined are on it: a pending invitation has no name yet.
 */
export function buildSnapshot(
  data: ProposalData,
  versionNumber: number,
  submittedAt: Date,
): ProposalSnapshot {
  const { proposal: p, observations } = data;
  const targetsById = new Map(data.targets.map((t) => [t.id, t]));
  const hoursByConfiguration: Record<string, number> = {};
  for (const o of observations) {
    const name = o.configuration?.name ?? o.configurationId;
    hoursByConfiguration[name] = round((hoursByConfiguration[name] ?? 0) + o.hoursAsked);
  }
  return {
    reference: p.reference,
    version: versionNumber,
    submittedAt: submittedAt.toISOString(),
    call: { code: p.call.code, title: p.call.title, anonymous: p.call.anonymousReview },
    title: p.title,
    abstract: p.abstract,
    scienceCategory: p.scienceCategory ?? '',
    kind: p.kind,
    continues: data.continuesReference,
    team: data.members
      .filter((m) => m.joined)
      .map((m) => ({
        name: m.name ?? m.email,
        email: m.email,
        affiliation: m.affiliation ?? '',
        country: m.country ?? '',
        role: m.role,
      })),
    targets: data.targets.map((t) => ({
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      extentArcsec: t.extentArcsec,
      fluxDensityMJy: t.fluxDensityMJy,
      line: targetLine(t),
    })),
    observations: observations.map((o) => ({
      targetName: targetsById.get(o.targetId)?.name ?? '',
      bandName: o.band?.name ?? '',
      configurationName: o.configuration?.name ?? '',
      frequencyGHz: o.frequencyGHz ?? o.result.skyFrequencyGHz,
      bandwidthMHz: o.bandwidthMHz,
      spectralResolutionKHz: o.spectralResolutionKHz,
      polarizations: o.polarizations,
      rmsGoalMicroJy: o.rmsGoalMicroJy,
      resolutionGoalArcsec: o.resolutionGoalArcsec,
      hoursAsked: o.hoursAsked,
      result: o.result,
      checks: observationChecks(p.call, o),
    })),
    hoursByConfiguration,
    totalHours: round(totalHoursAsked(observations)),
    scienceCase: data.scienceCase && {
      filename: data.scienceCase.filename,
      sha256: data.scienceCase.sha256,
      pages: data.scienceCase.pages,
      sizeBytes: data.scienceCase.sizeBytes,
    },
  };
}
