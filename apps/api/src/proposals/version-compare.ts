import type { ProposalSnapshot, SnapshotObservation, SnapshotTarget } from './proposal-snapshot.js';

export interface VersionChange {
  /** Where in the snapshot, for the web app to place or group it. */
  path: string;
  /** What a person reads: "Observation 2 · hours asked". */
  label: string;
  before: unknown;
  after: unknown;
}

const ROLE = { pi: 'PI', coi: 'Co-I' } as const;

const PROPOSAL_FIELDS: [keyof ProposalSnapshot, string][] = [
  ['title', 'Title'],
  ['abstract', 'Abstract'],
  ['scienceCategory', 'Science category'],
  ['kind', 'Kind'],
  ['continues', 'Continues'],
];

const TARGET_FIELDS: [keyof SnapshotTarget, string][] = [
  ['name', 'name'],
  ['raDeg', 'right ascension (°)'],
  ['decDeg', 'declination (°)'],
  ['extentArcsec', 'extent (″)'],
  ['fluxDensityMJy', 'flux density (mJy)'],
  ['line', 'line'],
];

const OBSERVATION_FIELDS: [keyof SnapshotObservation, string][] = [
  ['targetName', 'target'],
  ['bandName', 'band'],
  ['configurationName', 'configuration'],
  ['frequencyGHz', 'frequency (GHz)'],
  ['bandwidthMHz', 'bandwidth (MHz)'],
  ['spectralResolutionKHz', 'spectral resolution (kHz)'],
  ['polarizations', 'polarisations'],
  ['rmsGoalMicroJy', 'rms goal (µJy)'],
  ['resolutionGoalArcsec', 'resolution goal (″)'],
  ['hoursAsked', 'hours asked'],
];

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * What changed from one submitted version to another, field by field. Team members are matched by
 * address, targets by name, observations by their place in the list (as the editor numbers them).
 */
export function compareSnapshots(from: ProposalSnapshot, to: ProposalSnapshot): VersionChange[] {
  const changes: VersionChange[] = [];
  const add = (path: string, label: string, before: unknown, after: unknown) => {
    if (!same(before, after))
      changes.push({ path, label, before: before ?? null, after: after ?? null });
  };

  for (const [field, label] of PROPOSAL_FIELDS) add(field, label, from[field], to[field]);

  const teamBefore = new Map(from.team.map((m) => [m.email, m]));
  const teamAfter = new Map(to.team.map((m) => [m.email, m]));
  for (const email of new Set([...teamBefore.keys(), ...teamAfter.keys()])) {
    const a = teamBefore.get(email);
    const b = teamAfter.get(email);
    const name = (b ?? a)?.name ?? email;
    if (!a || !b) add(`team.${email}`, `Team · ${name}`, a && ROLE[a.role], b && ROLE[b.role]);
    else {
      add(`team.${email}.role`, `Team · ${name} · role`, ROLE[a.role], ROLE[b.role]);
      add(
        `team.${email}.affiliation`,
        `Team · ${name} · affiliation`,
        a.affiliation,
        b.affiliation,
      );
    }
  }

  const key = (t: SnapshotTarget) => t.name.trim().toLowerCase();
  const targetsBefore = new Map(from.targets.map((t) => [key(t), t]));
  const targetsAfter = new Map(to.targets.map((t) => [key(t), t]));
  for (const k of new Set([...targetsBefore.keys(), ...targetsAfter.keys()])) {
    const a = targetsBefore.get(k);
    const b = targetsAfter.get(k);
    const name = (b ?? a)?.name ?? k;
    if (!a || !b) add(`targets.${name}`, `Target ${name}`, a, b);
    else
      for (const [field, label] of TARGET_FIELDS)
        add(`targets.${name}.${field}`, `Target ${name} · ${label}`, a[field], b[field]);
  }

  const count = Math.max(from.observations.length, to.observations.length);
  for (let i = 0; i < count; i++) {
    const a = from.observations[i];
    const b = to.observations[i];
    const summary = (o?: SnapshotObservation) =>
      o && {
        target: o.targetName,
        band: o.bandName,
        configuration: o.configurationName,
        frequencyGHz: o.frequencyGHz,
        hoursAsked: o.hoursAsked,
      };
    if (!a || !b) add(`observations.${i}`, `Observation ${i + 1}`, summary(a), summary(b));
    else
      for (const [field, label] of OBSERVATION_FIELDS)
        add(`observations.${i}.${field}`, `Observation ${i + 1} · ${label}`, a[field], b[field]);
  }
  add('totalHours', 'Total hours asked', from.totalHours, to.totalHours);

  const doc = (s: ProposalSnapshot['scienceCase']) =>
    s && { filename: s.filename, pages: s.pages, sizeBytes: s.sizeBytes, sha256: s.sha256 };
  if (from.scienceCase?.sha256 !== to.scienceCase?.sha256)
    changes.push({
      path: 'scienceCase',
      label: 'Science case',
      before: doc(from.scienceCase),
      after: doc(to.scienceCase),
    });
  return changes;
}
