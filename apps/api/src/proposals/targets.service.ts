import { Injectable } from '@nestjs/common';
import { isUUID } from 'class-validator';
import type { EntityManager } from 'typeorm';
import { assertAllowed } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import {
  conflict,
  type FieldIssue,
  notFound,
  validationFailed,
} from '../common/errors/app-error.js';
import type { ProposalResponse } from './dto/proposal.response.js';
import type {
  CreateTargetDto,
  ImportPreviewResponse,
  ImportRowResponse,
  ImportTargetsDto,
  TargetFieldsDto,
  UpdateTargetDto,
} from './dto/target.dto.js';
import { ProposalObservation } from './entities/proposal-observation.entity.js';
import { ProposalTarget } from './entities/proposal-target.entity.js';
import { ObservationsService } from './observations.service.js';
import { ProposalAccess, type WriteContext } from './proposal-access.service.js';
import { type CsvRow, parseTargetCsv } from './target-csv.js';
import {
  parseTarget,
  type TargetColumns,
  type TargetField,
  type TargetFields,
} from './target-values.js';

const FORM_PATH: Record<TargetField, string> = {
  name: 'name',
  ra: 'ra',
  dec: 'dec',
  extentArcsec: 'extentArcsec',
  fluxDensityMJy: 'fluxDensityMJy',
  restGHz: 'line.restGHz',
  velocityKmS: 'line.velocityKmS',
  convention: 'line.convention',
  redshift: 'line.redshift',
};

/** Targets: the form, and the CSV import with its preview. */
@Injectable()
export class TargetsService {
  constructor(
    private readonly access: ProposalAccess,
    private readonly observations: ObservationsService,
  ) {}

  async create(
    user: SessionUser,
    reference: string,
    dto: CreateTargetDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const values = fromForm(dto);
      await this.assertNameFree(ctx.manager, ctx.proposal.id, [values.name], () => 'name', null);
      const position = await this.nextPosition(ctx.manager, ctx.proposal.id);
      const saved = await ctx.manager.save(
        ctx.manager.create(ProposalTarget, { ...values, proposalId: ctx.proposal.id, position }),
      );
      await ctx.audit('proposal.target_added', { targetId: saved.id, name: values.name });
    });
  }

  async update(
    user: SessionUser,
    reference: string,
    targetId: string,
    dto: UpdateTargetDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const target = await this.find(ctx.manager, ctx.proposal.id, targetId);
      const line =
        dto.line === undefined
          ? target.lineRestGHz === null
            ? null
            : {
                restGHz: target.lineRestGHz,
                velocityKmS: target.lineVelocityKmS,
                convention: target.lineConvention,
                redshift: target.lineRedshift,
              }
          : dto.line;
      const values = fromForm({
        name: dto.name ?? target.name,
        // Degrees print and parse back to the very same number.
        ra: dto.ra ?? String(target.raDeg),
        dec: dto.dec ?? String(target.decDeg),
        extentArcsec: dto.extentArcsec ?? target.extentArcsec,
        fluxDensityMJy:
          dto.fluxDensityMJy === undefined ? target.fluxDensityMJy : dto.fluxDensityMJy,
        line,
      });
      if (values.name.toLowerCase() !== target.name.toLowerCase())
        await this.assertNameFree(
          ctx.manager,
          ctx.proposal.id,
          [values.name],
          () => 'name',
          target.id,
        );
      Object.assign(target, values);
      await ctx.manager.save(target);
      await this.recalculateFor(ctx, target);
      await ctx.audit('proposal.target_updated', { targetId: target.id, name: target.name });
    });
  }

  async remove(
    user: SessionUser,
    reference: string,
    targetId: string,
    version: number,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, version, { right: 'edit' }, async (ctx) => {
      const target = await this.find(ctx.manager, ctx.proposal.id, targetId);
      const used = await ctx.manager.countBy(ProposalObservation, { targetId: target.id });
      if (used > 0)
        throw conflict(
          'TARGET_IN_USE',
          `Target ${target.name} is used by ${used} observation${used > 1 ? 's' : ''}; remove ${used > 1 ? 'them' : 'it'} first`,
        );
      await ctx.manager.delete(ProposalTarget, { id: target.id });
      await ctx.audit('proposal.target_removed', { targetId: target.id, name: target.name });
    });
  }

  /**
   * A dry run answers each row as read, with its errors, and saves nothing. Otherwise every row
   * is saved in one transaction, or none: a single bad row is a 400 naming `rows.<i>.<column>`.
   */
  async import(
    user: SessionUser,
    reference: string,
    dto: ImportTargetsDto,
  ): Promise<ImportPreviewResponse | ProposalResponse> {
    if (dto.dryRun) {
      const { data, me } = await this.access.read(user, reference);
      assertAllowed(
        me.canEdit,
        'You can read this proposal but not change it: ask the PI for the edit right',
      );
      const rows = parseTargetCsv(dto.csv);
      markDuplicates(
        rows,
        data.targets.map((t) => t.name),
      );
      return preview(rows);
    }
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const rows = parseTargetCsv(dto.csv);
      const existing = await ctx.manager.find(ProposalTarget, {
        where: { proposalId: ctx.proposal.id },
        select: { name: true },
      });
      markDuplicates(
        rows,
        existing.map((t) => t.name),
      );
      const issues: FieldIssue[] = rows.flatMap((row, i) =>
        row.errors.map((e) => ({
          path: `rows.${i}.${e.column}`,
          message: `line ${row.line}: ${e.message}`,
        })),
      );
      if (issues.length)
        throw validationFailed(
          issues,
          `${rows.filter((r) => r.errors.length).length} of ${rows.length} rows have errors; nothing was imported`,
        );
      let position = await this.nextPosition(ctx.manager, ctx.proposal.id);
      await ctx.manager.insert(
        ProposalTarget,
        rows.map((row) => ({
          ...(row.values as TargetColumns),
          proposalId: ctx.proposal.id,
          position: position++,
        })),
      );
      await ctx.audit('proposal.targets_imported', { count: rows.length });
    });
  }

  /** Observations of a changed target get the calculator's numbers for its new values. */
  private async recalculateFor(ctx: WriteContext, target: ProposalTarget): Promise<void> {
    const observations = await ctx.manager.find(ProposalObservation, {
      where: { targetId: target.id },
      relations: { band: true, configuration: true },
      order: { position: 'ASC' },
    });
    for (const o of observations) {
      if (o.frequencyGHz === null && target.lineRestGHz === null)
        throw validationFailed([
          {
            path: 'line',
            message: `An observation of ${target.name} is set to the target's line; give it a frequency before removing the line`,
          },
        ]);
      await this.observations.recalculate(ctx, o, target);
    }
  }

  private async assertNameFree(
    manager: EntityManager,
    proposalId: string,
    names: string[],
    path: (i: number) => string,
    except: string | null,
  ): Promise<void> {
    const taken = (await manager.query(
      `SELECT lower(name) AS name FROM proposal_targets
        WHERE proposal_id = $1 AND lower(name) = ANY($2::text[]) AND id IS DISTINCT FROM $3`,
      [proposalId, names.map((n) => n.toLowerCase()), except],
    )) as { name: string }[];
    const set = new Set(taken.map((t) => t.name));
    const issues = names.flatMap((n, i) =>
      set.has(n.toLowerCase())
        ? [{ path: path(i), message: `A target named ${n} is already in this proposal` }]
        : [],
    );
    if (issues.length) throw validationFailed(issues);
  }

  private async nextPosition(manager: EntityManager, proposalId: string): Promise<number> {
    const [{ next }] = (await manager.query(
      `SELECT COALESCE(max(position), 0) + 1 AS next FROM proposal_targets WHERE proposal_id = $1`,
      [proposalId],
    )) as [{ next: number }];
    return next;
  }

  private async find(
    manager: EntityManager,
    proposalId: string,
    id: string,
  ): Promise<ProposalTarget> {
    const target = isUUID(id) ? await manager.findOneBy(ProposalTarget, { id, proposalId }) : null;
    if (!target) throw notFound('Target');
    return target;
  }
}

function fromForm(dto: TargetFieldsDto): TargetColumns {
  const fields: TargetFields = {
    name: dto.name,
    ra: dto.ra,
    dec: dto.dec,
    extentArcsec: dto.extentArcsec ?? null,
    fluxDensityMJy: dto.fluxDensityMJy ?? null,
    restGHz: dto.line?.restGHz ?? null,
    velocityKmS: dto.line?.velocityKmS ?? null,
    convention: dto.line?.convention ?? null,
    redshift: dto.line?.redshift ?? null,
  };
  const { values, issues } = parseTarget(fields, (f) => FORM_PATH[f]);
  if (!values) throw validationFailed(issues);
  return values;
}

/** A name already in the proposal, or used by an earlier row of the file, is an error. */
function markDuplicates(rows: CsvRow[], existing: string[]): void {
  const seen = new Map(existing.map((n) => [n.trim().toLowerCase(), 'the proposal']));
  for (const row of rows) {
    const name = (row.cells.name ?? '').toLowerCase();
    if (name === '') continue;
    const where = seen.get(name);
    if (where) {
      row.errors.push({
        column: 'name',
        message: `A target named ${row.cells.name} is already in ${where}`,
      });
      row.values = null;
    } else seen.set(name, `line ${row.line}`);
  }
}

function preview(rows: CsvRow[]): ImportPreviewResponse {
  const out: ImportRowResponse[] = rows.map((row) => ({
    line: row.line,
    name: row.read.name ?? row.cells.name ?? '',
    raDeg: row.read.raDeg ?? null,
    decDeg: row.read.decDeg ?? null,
    extentArcsec: row.read.extentArcsec ?? null,
    fluxDensityMJy: row.read.fluxDensityMJy ?? null,
    restGHz: row.read.lineRestGHz ?? null,
    velocityKmS: row.read.lineVelocityKmS ?? null,
    convention: row.read.lineConvention ?? null,
    redshift: row.read.lineRedshift ?? null,
    errors: row.errors,
  }));
  const invalid = out.filter((r) => r.errors.length > 0).length;
  return { rows: out, valid: out.length - invalid, invalid };
}
