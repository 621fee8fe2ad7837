import { sampleSnapshot } from '../documents/testing/sample-snapshot.js';
import { compareSnapshots } from './version-compare.js';

describe('compareSnapshots', () => {
  it('finds nothing between a version and itself', () => {
    const s = sampleSnapshot();
    expect(compareSnapshots(s, structuredClone(s))).toEqual([]);
  });

  it('labels each change for a reader, matching people by address and targets by name', () => {
    const before = sampleSnapshot({ observations: 2 });
    const after = structuredClone(before);
    after.title = 'A new title';
    after.team = after.team.filter((m) => m.role === 'pi');
    after.team[0]!.affiliation = 'Somewhere else';
    after.targets[0]!.decDeg += 1;
    after.observations[1]!.hoursAsked = 9;
    after.observations.push(structuredClone(after.observations[0]!));
    after.totalHours += 99;

    const changes = compareSnapshots(before, after);
    const labels = changes.map((c) => c.label);
    const pi = before.team.find((m) => m.role === 'pi')!;
    const removed = before.team.filter((m) => m.role === 'coi');
    expect(labels).toEqual([
      'Title',
      `Team · ${pi.name} · affiliation`,
      ...removed.map((m) => `Team · ${m.name}`),
      `Target ${before.targets[0]!.name} · declination (°)`,
      'Observation 2 · hours asked',
      'Observation 3',
      'Total hours asked',
    ]);
    expect(changes.find((c) => c.label === `Team · ${removed[0]!.name}`)).toMatchObject({
      before: 'Co-I',
      after: null,
    });
    expect(changes.find((c) => c.label === 'Observation 3')).toMatchObject({
      path: 'observations.2',
      before: null,
      after: expect.objectContaining({ hoursAsked: before.observations[0]!.hoursAsked }),
    });
  });

  it('reports a new science case by its hash, not by its name', () => {
    const before = sampleSnapshot();
    const renamed = structuredClone(before);
    renamed.scienceCase = { ...renamed.scienceCase!, filename: 'other-name.pdf' };
    expect(compareSnapshots(before, renamed)).toEqual([]);
    const replaced = structuredClone(before);
    replaced.scienceCase = { ...replaced.scienceCase!, sha256: 'f'.repeat(64), pages: 2 };
    expect(compareSnapshots(before, replaced)).toEqual([
      expect.objectContaining({
        path: 'scienceCase',
        after: expect.objectContaining({ pages: 2 }),
      }),
    ]);
  });
});
