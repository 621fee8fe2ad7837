import { createHash } from 'node:crypto';
import { evaluateObservation } from '@skyhours/calc';
import PDFDocument from 'pdfkit';
import type { DataSource, EntityManager } from 'typeorm';
import { hashPassword } from '../auth/password.js';
import type { ProposalKind } from '../calls/call-lifecycle.js';
import { Call } from '../calls/entities/call.entity.js';
import { CompiledPdfService } from '../documents/compiled-pdf.service.js';
import { ScienceCaseDocument } from '../documents/entities/science-case-document.entity.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import { ProposalMember } from '../proposals/entities/proposal-member.entity.js';
import { ProposalObservation } from '../proposals/entities/proposal-observation.entity.js';
import { ProposalTarget } from '../proposals/entities/proposal-target.entity.js';
import { ProposalVersion } from '../proposals/entities/proposal-version.entity.js';
import { type ProposalStatus, Proposal } from '../proposals/entities/proposal.entity.js';
import { calculateObservation, targetLine } from '../proposals/observation-calculation.js';
import { ProposalLoader } from '../proposals/proposal-loader.js';
import { SCIENCE_CATEGORIES } from '../proposals/proposal-options.js';
import { buildSnapshot } from '../proposals/snapshot-builder.js';
import { User } from '../users/entities/user.entity.js';
import type { DemoContext } from './demo-context.js';
import { DEMO_OBSERVATORY } from './demo-observatory.js';

/*
 * The demo's proposals: invented people at invented institutes, proposing invented science to the
 * Larkspur Valley Array. In the open call SP27 a few drafts and submitted proposals (the demo
 * proposer is PI of a draft with a warning to fix and of a submitted proposal, and Co-I of
 * another draft); in AU26, which is in deliberation, 40 submitted proposals with their versions
 * and compiled PDFs. The data come from a small deterministic generator, so every load is alike.
 */

const DAY = 86_400_000;
const PROPOSER = 'proposer@skyhours.test';
/** The SP26 proposal the demo proposer leads (allocated, partly observed). */
export const SP26_PROPOSER_NUMBER = 4;
/** HI rest frequency, Hellwig et al. 1970 (SCIENCE.md). */
const HI_GHZ = 1.420405751768;

export const INSTITUTES = [
  { name: 'Harrowgate Institute for Radio Studies', country: 'GB', domain: 'harrowgate.example' },
  {
    name: 'Department of Physics, University of North Ambervale',
    country: 'CA',
    domain: 'north-ambervale.example',
  },
  {
    name: 'Qelbridge Institute for Radio Astrophysics',
    country: 'KE',
    domain: 'qelbridge.example',
  },
  {
    name: 'Centre for Cosmic Magnetism, Tallowmere College',
    country: 'PL',
    domain: 'tallowmere.example',
  },
  {
    name: 'School of Physics, Corrin Sound University',
    country: 'AU',
    domain: 'corrin-sound.example',
  },
  { name: 'Instituto de Astrofísica de Valmira', country: 'ES', domain: 'valmira.example' },
  { name: 'Observatoire de Saint-Aurèle', country: 'FR', domain: 'saint-aurele.example' },
  { name: 'Kaltenau University of Technology', country: 'DE', domain: 'kaltenau.example' },
  { name: 'Sundara Institute of Space Science', country: 'IN', domain: 'sundara.example' },
  {
    name: 'Laboratório de Radioastronomia de Serra Alvorada',
    country: 'BR',
    domain: 'serra-alvorada.example',
  },
  { name: 'Hoshikawa Institute for Astronomy', country: 'JP', domain: 'hoshikawa.example' },
  { name: 'Whenua Roa University', country: 'NZ', domain: 'whenua-roa.example' },
  { name: 'Nordvik Space Physics Institute', country: 'NO', domain: 'nordvik.example' },
  { name: 'Cape Meridian University', country: 'ZA', domain: 'cape-meridian.example' },
  { name: 'Université de Rivière-Claire', country: 'CA', domain: 'riviere-claire.example' },
] as const;

/** Given name, family name, institute (index above). Invented combinations, all of them. */
const PEOPLE: [string, string, number][] = [
  ['Elspeth', 'Marrowby', 0],
  ['Tobias', 'Finchley-Oduya', 0],
  ['Harriet', 'Quennell', 0],
  ['Ravi', 'Castellane', 0],
  ['Maude', 'Ferrisholm', 1],
  ['Jonah', 'Whitlake', 1],
  ['Anouk', 'Desrosiers-Lam', 1],
  ['Baraka', 'Mwanzia-Hale', 2],
  ['Wanjiru', 'Otieno-Brand', 2],
  ['Kipchoge', 'Leshan', 2],
  ['Zofia', 'Wrzosek', 3],
  ['Marek', 'Olszanowski', 3],
  ['Agata', 'Brzezinska-Holt', 3],
  ['Callum', 'Yarrowby', 4],
  ['Mei-Ling', 'Thornbury', 4],
  ['Isla', 'Kendricks', 4],
  ['Lucía', 'Arrebola Mestre', 5],
  ['Íñigo', 'Salcedo Viana', 5],
  ['Candela', 'Obregón', 5],
  ['Margaux', 'Lavallière', 6],
  ['Théo', 'Brassac-Nguyen', 6],
  ['Solène', 'Ducharmeau', 6],
  ['Friederike', 'Osterwald', 7],
  ['Jannik', 'Brückner-Sall', 7],
  ['Henrike', 'Vossberg', 7],
  ['Ananya', 'Raghunathan', 8],
  ['Vikram', 'Seshadri-Moore', 8],
  ['Priyamvada', 'Kolhatkar', 8],
  ['Tiago', 'Albuquerque Rocha', 9],
  ['Luana', 'Ferraz de Mello', 9],
  ['Caio', 'Brandão Lessa', 9],
  ['Haruka', 'Tsujimoto', 10],
  ['Ren', 'Okabayashi', 10],
  ['Sayuri', 'Minegishi', 10],
  ['Aroha', 'Tipene-Walsh', 11],
  ['Nikau', 'Rangiwhetu', 11],
  ['Freya', 'Callander', 11],
  ['Solveig', 'Haugstad', 12],
  ['Eirik', 'Tveitnes', 12],
  ['Ingvild', 'Rønneberg', 12],
  ['Thandeka', 'Mokoena-Fry', 13],
  ['Pieter', 'van Rensloo', 13],
  ['Nomvula', 'Dlamini-Ashe', 13],
  ['Élodie', 'Marchessault', 14],
  ['Gaspard', 'Tremblay-Ouellet', 14],
  ['Amara', 'Okonjo-Reyes', 1],
  ['Dmitri', 'Lavrentyev', 3],
  ['Yusuf', 'Karaderin', 7],
  ['Leilani', 'Kahananui', 11],
  ['Omar', 'Haddadin', 5],
  ['Sigrún', 'Jökulsdóttir', 12],
  ['Tomás', 'Ó Faoláin', 0],
  ['Chiara', 'Benvenisti', 6],
  ['Bongani', 'Nxumalo', 13],
  ['Xu', 'Wenjing', 10],
  ['Nadia', 'Belkacem', 6],
  ['Kwabena', 'Asante-Moy', 2],
  ['Rosalind', 'Teague', 4],
  ['Mateus', 'Quintela', 9],
  ['Aino', 'Leppävuori', 12],
];

/** A small deterministic generator (mulberry32) with a fixed start, so loads are repeatable. */
export function generator(start: number) {
  let a = start >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (min: number, max: number) => min + Math.floor(next() * (max - min + 1)),
    pick: <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)] as T,
    range: (min: number, max: number) => min + next() * (max - min),
  };
}
export type Generator = ReturnType<typeof generator>;

/** Titles per science category, with an invented object to fill in. */
const TITLES: Record<(typeof SCIENCE_CATEGORIES)[number], string[]> = {
  'Cosmology and distant galaxies': [
    'Radio continuum of star-forming galaxies in the {field}',
    'Faint radio sources behind the {field}: a deep pointing',
    'Cold gas in galaxies of the {group} at intermediate redshift',
  ],
  'Nearby galaxies': [
    'Neutral hydrogen in the outskirts of {galaxy}',
    'The gas disc and warp of {galaxy}',
    'Tidal gas between {galaxy} and its companions',
  ],
  'Active galaxies and jets': [
    'Jet bending in the radio galaxy {source}',
    'Variability of the compact core of {source}',
    'Relic lobes around {source}: spectral ageing',
  ],
  'Gas and dust in the Milky Way': [
    'Absorption against background sources across the {cloud}',
    'Ionised gas in the {cloud}',
  ],
  'Star and planet formation': [
    'Free-free emission from young stars in the {cloud}',
    'Radio jets of protostars in the {cloud}',
  ],
  'Stars and stellar remnants': [
    'Radio flares of the active binary {star}',
    'The expanding shell of the nova {star}',
  ],
  'Pulsars and fast transients': [
    'Imaging the wind nebula of pulsar {pulsar}',
    'A search for persistent radio emission near {pulsar}',
  ],
  'Solar system': ['Thermal emission of the comet {comet} near perihelion'],
  'Magnetic fields': [
    'Faraday rotation across the {group}',
    'Polarised emission of the {field} filament',
  ],
  'Techniques and surveys': [
    'A pilot mosaic of the {field} at two frequencies',
    'Calibrating wide-field polarisation in the {field}',
  ],
};

const NAMES = {
  field: ['Larkspur Deep Field', 'Corrin Strip', 'Ambervale Window', 'Tallow Gap'],
  group: ['Qelbridge group', 'Marrow cluster', 'Whitlake supercluster arm', 'Nordvik pair'],
  galaxy: ['LVA G112.4+38.1', 'LVA G204.7+22.9', 'LVA G061.3+51.2', 'LVA G150.9+64.0'],
  source: ['LVA J0412+3340', 'LVA J1522+2710', 'LVA J0907+4405', 'LVA J2231+1218'],
  cloud: ['Harrow dark cloud', 'Kestrel complex', 'Saint-Aurèle ridge', 'Valmira filament'],
  star: ['LVA V1174', 'LVA V0388', 'LVA V2051'],
  pulsar: ['LVA P0630+19', 'LVA P1748+07', 'LVA P2012+33'],
  comet: ['LVA C/2026 K3', 'LVA C/2027 A1'],
};

const SENTENCES = [
  'The emission we propose to map has been seen only at low resolution, where it blends with its surroundings.',
  'Our earlier observations with a single dish detected the signal but could not locate it.',
  'The requested sensitivity reaches the brightness that our models predict for the faint outer regions.',
  'With the longest baselines we separate the compact components from the extended emission.',
  'The compact configuration recovers the largest scales, which carry most of the flux.',
  'Two frequencies give the spectral index, which tells thermal from non-thermal emission.',
  'We have chosen the bandwidth to reach the sensitivity without losing the spectral information we need.',
  'The targets rise high at the site for several hours, which keeps the system temperature low.',
  'The observations complete a sample whose other members were observed in earlier semesters.',
  'Each target is observed in several short scans spread over its hours above the limit, to fill the aperture plane.',
  'The results will be compared with simulations run by members of the team for this purpose.',
  'A non-detection at the requested depth would itself rule out the simplest of the competing models.',
  'The data reduction follows the observatory pipeline, with self-calibration where the sources allow it.',
  'Polarisation calibration uses a source of known angle observed at the start and end of each block.',
  'The mosaic pointings are spaced at half the primary beam so that the sensitivity is nearly uniform.',
  'The line is expected to be a few tens of kilometres per second wide, which the channels sample well.',
];

interface DemoPerson {
  id: string;
  name: string;
  email: string;
}

interface ObservationPlan {
  band: ReceiverBand;
  configuration: Configuration;
  frequencyGHz: number | null;
  bandwidthMHz: number;
  polarizations: 1 | 2;
  rmsGoalMicroJy: number;
  hoursAsked: number;
  targetIndex: number;
}

interface TargetPlan {
  name: string;
  raDeg: number;
  decDeg: number;
  extentArcsec: number;
  fluxDensityMJy: number | null;
  lineRestGHz: number | null;
  lineVelocityKmS: number | null;
  lineConvention: 'radio' | 'optical' | null;
}

interface ProposalPlan {
  call: Call;
  number: number;
  status: ProposalStatus;
  title: string;
  abstract: string;
  category: string;
  kind: ProposalKind;
  pi: DemoPerson;
  cois: { person: DemoPerson; canEdit: boolean }[];
  targets: TargetPlan[];
  observations: ObservationPlan[];
  pages: number;
  /** For submitted ones: when. */
  submittedAt: Date | null;
  /** Below 1: less time than the goal needs (a TIME_SHORT_OF_GOAL warning). */
  timeFactor?: number;
}

interface ArrayRecords {
  observatory: Observatory;
  bands: ReceiverBand[];
  configurations: Configuration[];
}

export async function loadDemoProposals(
  manager: EntityManager,
  context: DemoContext,
): Promise<void> {
  const g = generator(0x5c1e27);
  const people = await makePeople(manager, context);
  const observatory = await manager.findOneByOrFail(Observatory, { name: DEMO_OBSERVATORY });
  const records: ArrayRecords = {
    observatory,
    bands: await manager.findBy(ReceiverBand, { observatoryId: observatory.id }),
    configurations: await manager.findBy(Configuration, { observatoryId: observatory.id }),
  };
  const sp27 = await manager.findOneByOrFail(Call, { code: 'SP27' });
  const au26 = await manager.findOneByOrFail(Call, { code: 'AU26' });
  const proposer = context.users.get(PROPOSER);
  if (!proposer) throw new Error('the demo proposals need the demo proposer account');
  const me: DemoPerson = { id: proposer.id, name: proposer.name, email: proposer.email };

  const plans: ProposalPlan[] = [];
  const pool = [...people];
  const team = (size: number, avoid: DemoPerson[] = []) => {
    const chosen: DemoPerson[] = [];
    while (chosen.length < size) {
      const p = g.pick(pool);
      if (!chosen.includes(p) && !avoid.includes(p)) chosen.push(p);
    }
    return chosen;
  };
  const plan = (call: Call, number: number, over: Partial<ProposalPlan>): ProposalPlan => {
    const category = over.category ?? g.pick(SCIENCE_CATEGORIES);
    const [pi, ...cois] = team(g.int(2, 6));
    const targets = makeTargets(g, category);
    return {
      call,
      number,
      status: 'draft',
      title: makeTitle(g, category),
      abstract: paragraph(g, g.int(5, 9)),
      category,
      kind: g.next() < 0.8 ? 'standard' : g.next() < 0.6 ? 'large' : 'target_of_opportunity',
      pi: pi as DemoPerson,
      cois: cois.map((person) => ({ person, canEdit: g.next() < 0.5 })),
      targets,
      observations: makeObservations(g, records, targets, category),
      pages: g.int(2, 4),
      submittedAt: null,
      ...over,
    };
  };

  // SP27, open: the demo proposer's three, then other teams' drafts and submitted proposals.
  const before = (days: number) => new Date(context.now.getTime() - days * DAY);
  let n = 0;
  const warningDraft = plan(sp27, ++n, {
    title: 'Neutral hydrogen in the warped disc of LVA G204.7+22.9',
    category: 'Nearby galaxies',
    kind: 'standard',
    pi: me,
    timeFactor: 0.6,
  });
  // One line observation asking for 0.6 of the time its goal needs: a warning to fix, no blocker.
  warningDraft.targets = [
    {
      name: 'LVA G204.7+22.9',
      raDeg: 186.2,
      decDeg: 22.9,
      extentArcsec: 0,
      fluxDensityMJy: null,
      lineRestGHz: HI_GHZ,
      lineVelocityKmS: 1450,
      lineConvention: 'optical',
    },
  ];
  warningDraft.observations = [
    {
      band: records.bands.find((b) => b.name === 'L band') as ReceiverBand,
      configuration: records.configurations.find((c) => c.name === 'intermediate') as Configuration,
      frequencyGHz: null,
      bandwidthMHz: 16,
      polarizations: 2,
      rmsGoalMicroJy: 40,
      hoursAsked: 0,
      targetIndex: 0,
    },
  ];
  plans.push(warningDraft);
  plans.push(
    plan(sp27, ++n, {
      title: 'Free-free emission from young stars in the Kestrel complex',
      category: 'Star and planet formation',
      kind: 'standard',
      pi: me,
      status: 'submitted',
      submittedAt: before(2),
    }),
  );
  const withMe = plan(sp27, ++n, {
    title: 'Faraday rotation across the Qelbridge group',
    category: 'Magnetic fields',
  });
  withMe.cois = [{ person: me, canEdit: true }, ...withMe.cois];
  plans.push(withMe);
  for (let i = 0; i < 7; i++)
    plans.push(
      plan(sp27, ++n, i < 4 ? { status: 'submitted', submittedAt: before(g.int(1, 10)) } : {}),
    );

  // AU26, in deliberation: 40 submitted before its deadline, now under review.
  for (let i = 1; i <= 40; i++) {
    const days = g.range(0.1, 12);
    plans.push(
      plan(au26, i, {
        status: 'under_review',
        submittedAt: new Date(au26.deadlineAt.getTime() - days * DAY),
        kind: g.next() < 0.1 ? 'discretionary' : g.next() < 0.75 ? 'standard' : 'large',
      }),
    );
  }
  // The demo proposer is on one of them as a Co-I, so the outcome can reach them later.
  plans[plans.length - 5]!.cois.push({ person: me, canEdit: false });

  // WN26, in review: a short call's eight, submitted before its deadline.
  const wn26 = await manager.findOneByOrFail(Call, { code: 'WN26' });
  for (let i = 1; i <= 8; i++)
    plans.push(
      plan(wn26, i, {
        status: 'under_review',
        submittedAt: new Date(wn26.deadlineAt.getTime() - g.range(0.2, 6) * DAY),
        kind: g.next() < 0.25 ? 'target_of_opportunity' : 'standard',
      }),
    );

  // SP26, archived: twelve submitted, all in the intermediate configuration its semester used;
  // the outcomes section (demo-archive.ts) gives them their grants, statuses and runs.
  const sp26 = await manager.findOneByOrFail(Call, { code: 'SP26' });
  const intermediate = records.configurations.find((c) => c.name === 'intermediate')!;
  for (let i = 1; i <= 12; i++) {
    const p = plan(sp26, i, {
      status: 'under_review',
      submittedAt: new Date(sp26.deadlineAt.getTime() - g.range(0.2, 10) * DAY),
      kind: g.next() < 0.8 ? 'standard' : 'large',
      ...(i === SP26_PROPOSER_NUMBER
        ? {
            pi: me,
            title: 'Radio flares of the active binary LVA V0388',
            category: 'Stars and stellar remnants',
          }
        : {}),
    });
    for (const o of p.observations) o.configuration = intermediate;
    plans.push(p);
  }

  const ids = await saveProposals(manager, plans, records, g);
  await manager.query(
    `INSERT INTO proposal_counters (call_id, last_number)
     SELECT call_id, max(number) FROM proposals GROUP BY call_id
     ON CONFLICT (call_id) DO UPDATE SET last_number = EXCLUDED.last_number`,
  );
  await freezeVersions(manager, plans, ids);
}

async function makePeople(manager: EntityManager, context: DemoContext): Promise<DemoPerson[]> {
  const passwordHash = await hashPassword(context.password);
  const rows = PEOPLE.map(([given, family, institute]) => {
    const inst = INSTITUTES[institute]!;
    const local = `${given}.${family}`
      .normalize('NFKD')
      .replace(/\p{M}/gu, '')
      .toLowerCase()
      .replace(/[^a-z.]+/g, '-')
      .replace(/-+/g, '-');
    return manager.create(User, {
      email: `${local}@${inst.domain}`,
      name: `${given} ${family}`,
      affiliation: inst.name,
      country: inst.country,
      orcid: null,
      passwordHash,
      emailVerifiedAt: context.now,
      roles: [],
    });
  });
  const saved = await manager.save(User, rows);
  for (const user of saved) context.users.set(user.email, user);
  return saved.map((u) => ({ id: u.id, name: u.name, email: u.email }));
}

function makeTitle(g: Generator, category: string): string {
  const template = g.pick(TITLES[category as keyof typeof TITLES]);
  return template.replace(/\{(\w+)\}/g, (_, key: keyof typeof NAMES) => g.pick(NAMES[key]));
}

function paragraph(g: Generator, sentences: number): string {
  const chosen = new Set<string>();
  while (chosen.size < sentences) chosen.add(g.pick(SENTENCES));
  return [...chosen].join(' ');
}

function makeTargets(g: Generator, category: string): TargetPlan[] {
  const hydrogen = category === 'Nearby galaxies' || category === 'Cosmology and distant galaxies';
  return Array.from({ length: g.int(1, 3) }, (_, i) => {
    const line = hydrogen && g.next() < 0.7;
    const ra = g.range(0, 359.9);
    const dec = g.range(-12, 72);
    return {
      name: `LVA J${hhmm(ra)}${dec < 0 ? '−' : '+'}${String(Math.floor(Math.abs(dec))).padStart(2, '0')}${String.fromCharCode(65 + i)}`,
      raDeg: Math.round(ra * 1e4) / 1e4,
      decDeg: Math.round(dec * 1e4) / 1e4,
      extentArcsec: g.next() < 0.4 ? g.pick([30, 60, 120, 240, 480]) : 0,
      fluxDensityMJy: g.next() < 0.6 ? Math.round(g.range(0.2, 40) * 10) / 10 : null,
      lineRestGHz: line ? HI_GHZ : null,
      lineVelocityKmS: line ? Math.round(g.range(300, 9000)) : null,
      lineConvention: line ? (g.next() < 0.5 ? 'optical' : 'radio') : null,
    };
  });
}

const hhmm = (raDeg: number) => {
  const minutes = Math.floor((raDeg / 15) * 60);
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}${String(minutes % 60).padStart(2, '0')}`;
};

/** 1–3 setups the array can do; hours follow what the calculator says the goal needs. */
function makeObservations(
  g: Generator,
  records: ArrayRecords,
  targets: TargetPlan[],
  category: string,
): ObservationPlan[] {
  const bandNamed = (name: string) => records.bands.find((b) => b.name === name) as ReceiverBand;
  return Array.from({ length: g.int(1, 3) }, (_, i) => {
    const targetIndex = i % targets.length;
    const target = targets[targetIndex]!;
    const line = target.lineRestGHz !== null && i === 0;
    const bandName = line ? 'L band' : g.pick(['L band', 'S band', 'C band', 'X band']);
    const band = bandNamed(bandName);
    const frequencyGHz = line
      ? null
      : { 'L band': 1.5, 'S band': 3, 'C band': 6, 'X band': 10 }[bandName]!;
    const polarizations =
      band.polarizations.map(Number).includes(1) && category === 'Pulsars and fast transients'
        ? 1
        : 2;
    return {
      band,
      configuration: g.pick(records.configurations),
      frequencyGHz,
      bandwidthMHz: line
        ? g.pick([8, 16, 32])
        : Math.min(band.maxBandwidthMHz, g.pick([500, 1000, 2000])),
      polarizations,
      rmsGoalMicroJy: line ? g.pick([150, 250, 400]) : g.pick([4, 6, 10, 15, 25]),
      hoursAsked: 0,
      targetIndex,
    } satisfies ObservationPlan;
  });
}

/** The hours that reach the goal, rounded up to half hours; the goal moves until they lie in 1.5–60 h. */
function hoursFor(
  records: ArrayRecords,
  target: TargetPlan,
  o: ObservationPlan,
  factor: number,
): number {
  for (;;) {
    const { observatory: a } = records;
    const common = {
      array: {
        antennas: a.antennas,
        dishDiameterM: a.dishDiameterM,
        latitudeDeg: a.latitudeDeg,
        longitudeDeg: a.longitudeDeg,
        elevationLimitDeg: a.elevationLimitDeg,
        correlatorEfficiency: a.correlatorEfficiency,
        overheadFraction: a.overheadFraction,
        beamFactor: a.beamFactor,
      },
      configuration: o.configuration,
      band: o.band,
      bandwidthMHz: o.bandwidthMHz,
      polarizations: o.polarizations,
      target: { raDeg: target.raDeg, decDeg: target.decDeg, extentArcsec: target.extentArcsec },
      rmsGoalMicroJy: o.rmsGoalMicroJy,
    };
    const line = targetLine({ ...target, lineRedshift: null });
    const r = evaluateObservation(
      o.frequencyGHz === null && line
        ? { ...common, line }
        : { ...common, frequencyGHz: o.frequencyGHz ?? 1.5 },
    );
    const total = (r.onSourceHoursForGoal ?? 1) * r.pointings * (1 + a.overheadFraction) * factor;
    // A goal reached in minutes is not worth a proposal, one needing days not worth a demo.
    if (total < 1.5) o.rmsGoalMicroJy = Math.round((o.rmsGoalMicroJy / 1.6) * 100) / 100;
    else if (total > 60) o.rmsGoalMicroJy = Math.round(o.rmsGoalMicroJy * 1.6 * 100) / 100;
    else return Math.ceil(total * 2) / 2;
  }
}

/** A science case of `pages` pages in a standard PDF font, naming nobody. */
async function scienceCasePdf(g: Generator, title: string, pages: number): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 64,
    autoFirstPage: false,
    info: { Title: title },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve) => doc.on('end', resolve));
  const headings = [
    'Scientific justification',
    'Immediate objective',
    'Technical justification',
    'Expected results',
  ];
  for (let page = 0; page < pages; page++) {
    doc.addPage();
    if (page === 0) doc.font('Helvetica-Bold').fontSize(15).text(title, { width: 467 }).moveDown();
    doc
      .font('Helvetica-Bold')
      .fontSize(11)
      .text(headings[page % headings.length] as string)
      .moveDown(0.4);
    doc.font('Helvetica').fontSize(10.5);
    for (let p = 0; p < 3; p++)
      doc.text(paragraph(g, 5), { width: 467, lineGap: 2.5, align: 'justify' }).moveDown(0.6);
    if (page === 1) figure(doc, g);
  }
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

function figure(doc: InstanceType<typeof PDFDocument>, g: Generator): void {
  const x = 90;
  const y = Math.min(doc.y + 10, 560);
  const w = 380;
  const h = 150;
  doc
    .lineWidth(0.8)
    .strokeColor('#333333')
    .moveTo(x, y)
    .lineTo(x, y + h)
    .lineTo(x + w, y + h)
    .stroke();
  const centre = g.range(0.3, 0.7);
  doc.moveTo(x, y + h);
  for (let i = 0; i <= 80; i++) {
    const t = i / 80;
    doc.lineTo(x + t * w, y + h - h * (0.08 + 0.8 * Math.exp(-((t - centre) ** 2) / 0.015)));
  }
  doc.strokeColor('#2a3f71').stroke();
  doc.font('Helvetica').fontSize(8.5).fillColor('#333333');
  doc.text('Figure 1. Expected profile of the emission (invented for the demo).', x, y + h + 6);
  doc.fillColor('black');
}

async function saveProposals(
  manager: EntityManager,
  plans: ProposalPlan[],
  records: ArrayRecords,
  g: Generator,
): Promise<string[]> {
  const ids: string[] = [];
  for (const p of plans) {
    const createdAt = new Date((p.submittedAt ?? p.call.deadlineAt).getTime() - 20 * DAY);
    const proposal = await manager.save(
      manager.create(Proposal, {
        callId: p.call.id,
        number: p.number,
        reference: `${p.call.code}-${String(p.number).padStart(4, '0')}`,
        title: p.title,
        abstract: p.abstract,
        scienceCategory: p.category,
        kind: p.call.proposalKinds.includes(p.kind) ? p.kind : 'standard',
        status: p.status,
        version: p.submittedAt ? 12 : 8,
        createdById: p.pi.id,
        createdAt,
        updatedAt: p.submittedAt ?? createdAt,
      }),
    );
    ids.push(proposal.id);
    await manager.insert(ProposalMember, [
      {
        proposalId: proposal.id,
        userId: p.pi.id,
        email: p.pi.email,
        role: 'pi',
        canEdit: true,
        invitedById: p.pi.id,
        invitedAt: createdAt,
        joinedAt: createdAt,
      },
      ...p.cois.map(({ person, canEdit }) => ({
        proposalId: proposal.id,
        userId: person.id,
        email: person.email,
        role: 'coi' as const,
        canEdit,
        invitedById: p.pi.id,
        invitedAt: createdAt,
        joinedAt: createdAt,
      })),
    ]);
    const targets = await manager.save(
      p.targets.map((t, i) =>
        manager.create(ProposalTarget, {
          ...t,
          lineRedshift: null,
          proposalId: proposal.id,
          position: i + 1,
        }),
      ),
    );
    const rows = p.observations.map((o, i) => {
      const target = targets[o.targetIndex]!;
      o.hoursAsked = hoursFor(
        records,
        p.targets[o.targetIndex]!,
        o,
        p.timeFactor ?? g.range(1, 1.3),
      );
      const values = {
        frequencyGHz: o.frequencyGHz,
        bandwidthMHz: o.bandwidthMHz,
        polarizations: o.polarizations,
        rmsGoalMicroJy: o.rmsGoalMicroJy,
        resolutionGoalArcsec: null,
        hoursAsked: o.hoursAsked,
      };
      const { result, checks } = calculateObservation({
        observatory: records.observatory,
        band: o.band,
        configuration: o.configuration,
        target,
        observation: values,
      });
      return manager.create(ProposalObservation, {
        ...values,
        proposalId: proposal.id,
        position: i + 1,
        targetId: target.id,
        bandId: o.band.id,
        configurationId: o.configuration.id,
        spectralResolutionKHz: o.frequencyGHz === null ? 10 : null,
        result,
        checks,
      });
    });
    await manager.save(rows);
    const pdf = await scienceCasePdf(g, p.title, p.pages);
    await manager.insert(ScienceCaseDocument, {
      proposalId: proposal.id,
      filename: `${p.title
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .slice(0, 60)}.pdf`,
      contentType: 'application/pdf',
      sizeBytes: pdf.length,
      pages: p.pages,
      sha256: createHash('sha256').update(pdf).digest('hex'),
      content: pdf,
      uploadedBy: p.pi.id,
      uploadedAt: new Date(createdAt.getTime() + 5 * DAY),
      supersededAt: null,
    });
  }
  return ids;
}

/**
 * Version 1 of each submitted proposal: the snapshot as submission makes it and its compiled
 * PDF, a few at a time (the cover's typesetting is most of the demo's load time).
 */
async function freezeVersions(
  manager: EntityManager,
  plans: ProposalPlan[],
  ids: string[],
): Promise<void> {
  const compiler = new CompiledPdfService();
  const loader = new ProposalLoader(manager.connection as DataSource);
  const submitted = plans.flatMap((p, i) => (p.submittedAt ? [{ plan: p, id: ids[i]! }] : []));
  const data = new Map(
    (
      await loader.loadMany(
        submitted.map((s) => s.id),
        manager,
      )
    ).map((d) => [d.proposal.id, d]),
  );
  const BATCH = 4;
  for (let i = 0; i < submitted.length; i += BATCH) {
    const batch = submitted.slice(i, i + BATCH);
    // Queries one after another on the transaction's connection; only the PDFs in parallel.
    const inputs = [];
    for (const { plan, id } of batch) {
      const scienceCase = await manager
        .createQueryBuilder(ScienceCaseDocument, 'd')
        .addSelect('d.content')
        .where('d.proposal_id = :id', { id })
        .getOneOrFail();
      inputs.push({
        id,
        plan,
        scienceCase,
        snapshot: buildSnapshot(data.get(id)!, 1, plan.submittedAt!),
      });
    }
    const frozen = await Promise.all(
      inputs.map(async ({ id, plan, scienceCase, snapshot }) => ({
        id,
        plan,
        snapshot,
        pdf: await compiler.compile(snapshot, scienceCase.content ?? null),
        scienceCaseId: scienceCase.id,
      })),
    );
    for (const f of frozen) {
      await manager.insert(ProposalVersion, {
        proposalId: f.id,
        number: 1,
        submittedAt: f.plan.submittedAt!,
        submittedById: f.plan.pi.id,
        totalHours: f.snapshot.totalHours,
        snapshot: f.snapshot,
        scienceCaseId: f.scienceCaseId,
        compiledPdf: f.pdf,
        compiledPdfSha256: createHash('sha256').update(f.pdf).digest('hex'),
      });
      await manager.update(
        Proposal,
        { id: f.id },
        { submittedVersion: 1, submittedAt: f.plan.submittedAt! },
      );
    }
  }
}
