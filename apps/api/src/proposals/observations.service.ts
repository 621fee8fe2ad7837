import { Injectable } from '@nestjs/common';
import { isUUID } from 'class-validator';
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '../auth/session-user.js';
import { type FieldIssue, notFound, validationFailed } from '../common/errors/app-error.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import type { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import type {
  CreateObservationDto,
  ObservationFieldsDto,
  UpdateObservationDto,
} from './dto/observation.dto.js';
import type { ProposalResponse } from './dto/proposal.response.js';
import { ProposalObservation } from './entities/proposal-observation.entity.js';
import { ProposalTarget } from './entities/proposal-target.entity.js';
import { calculateObservation } from './observation-calculation.js';
import { ProposalAccess, type WriteContext } from './proposal-access.service.js';

type ObservationFields = Required<ObservationFieldsDto>;

/**
 * Observations. On every save the server runs the calculator library with the call's
 * observatory, the band and the configuration, and stores its numbers and checks beside the row.
 */
@Injectable()
export class ObservationsService {
  constructor(private readonly access: ProposalAccess) {}

  async create(
    user: SessionUser,
    reference: string,
    dto: CreateObservationDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const fields: ObservationFields = {
        targetId: dto.targetId,
        bandId: dto.bandId,
        configurationId: dto.configurationId,
        frequencyGHz: dto.frequencyGHz ?? null,
        bandwidthMHz: dto.bandwidthMHz,
        spectralResolutionKHz: dto.spectralResolutionKHz ?? null,
        polarizations: dto.polarizations,
        rmsGoalMicroJy: dto.rmsGoalMicroJy ?? null,
        resolutionGoalArcsec: dto.resolutionGoalArcsec ?? null,
        hoursAsked: dto.hoursAsked,
      };
      const computed = await this.compute(ctx, fields);
      const [{ next }] = (await ctx.manager.query(
        `SELECT COALESCE(max(position), 0) + 1 AS next FROM proposal_observations WHERE proposal_id = $1`,
        [ctx.proposal.id],
      )) as [{ next: number }];
      const saved = await ctx.manager.save(
        ctx.manager.create(ProposalObservation, {
          ...fields,
          ...computed,
          proposalId: ctx.proposal.id,
          position: next,
        }),
      );
      await ctx.audit('proposal.observation_added', {
        observationId: saved.id,
        hoursAsked: fields.hoursAsked,
      });
    });
  }

  async update(
    user: SessionUser,
    reference: string,
    observationId: string,
    dto: UpdateObservationDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const o = await this.find(ctx.manager, ctx.proposal.id, observationId);
      const pick = <K extends keyof ObservationFields>(k: K): ObservationFields[K] =>
        (dto[k] === undefined ? o[k] : dto[k]) as ObservationFields[K];
      const fields: ObservationFields = {
        targetId: pick('targetId'),
        bandId: pick('bandId'),
        configurationId: pick('configurationId'),
        frequencyGHz: pick('frequencyGHz'),
        bandwidthMHz: pick('bandwidthMHz'),
        spectralResolutionKHz: pick('spectralResolutionKHz'),
        polarizations: pick('polarizations'),
        rmsGoalMicroJy: pick('rmsGoalMicroJy'),
        resolutionGoalArcsec: pick('resolutionGoalArcsec'),
        hoursAsked: pick('hoursAsked'),
      };
      const computed = await this.compute(ctx, fields);
      await ctx.manager.update(ProposalObservation, { id: o.id }, { ...fields, ...computed });
      await ctx.audit('proposal.observation_updated', {
        observationId: o.id,
        fields: Object.keys(dto).filter((k) => k !== 'version'),
      });
    });
  }

  async remove(
    user: SessionUser,
    reference: string,
    observationId: string,
    version: number,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, version, { right: 'edit' }, async (ctx) => {
      const o = await this.find(ctx.manager, ctx.proposal.id, observationId);
      await ctx.manager.delete(ProposalObservation, { id: o.id });
      await ctx.audit('proposal.observation_removed', { observationId: o.id });
    });
  }

  /** New numbers for a stored observation (its target changed); `o` has band and configuration. */
  async recalculate(
    ctx: WriteContext,
    o: ProposalObservation,
    target: ProposalTarget,
  ): Promise<void> {
    const observatory = ctx.call.observatory as Observatory;
    const computed = calculateObservation({
      observatory,
      band: o.band as ReceiverBand,
      configuration: o.configuration as Configuration,
      target,
      observation: o,
    });
    await ctx.manager.update(ProposalObservation, { id: o.id }, computed);
  }

  /** Checks the references against the proposal and the observatory, then runs the calculator. */
  private async compute(ctx: WriteContext, f: ObservationFields) {
    const observatory = ctx.call.observatory as Observatory;
    const target = await ctx.manager.findOneBy(ProposalTarget, {
      id: f.targetId,
      proposalId: ctx.proposal.id,
    });
    const band = await ctx.manager.findOneBy(ReceiverBand, {
      id: f.bandId,
      observatoryId: observatory.id,
    });
    const configuration = await ctx.manager.findOneBy(Configuration, {
      id: f.configurationId,
      observatoryId: observatory.id,
    });
    const issues: FieldIssue[] = [];
    if (!target)
      issues.push({ path: 'targetId', message: 'targetId is not a target of this proposal' });
    if (!band)
      issues.push({
        path: 'bandId',
        message: `bandId is not a receiver band of ${observatory.name}`,
      });
    if (!configuration)
      issues.push({
        path: 'configurationId',
        message: `configurationId is not a configuration of ${observatory.name}`,
      });
    if (f.spectralResolutionKHz !== null && f.spectralResolutionKHz > f.bandwidthMHz * 1000)
      issues.push({
        path: 'spectralResolutionKHz',
        message: `The spectral resolution of ${f.spectralResolutionKHz} kHz is wider than the bandwidth of ${f.bandwidthMHz} MHz`,
      });
    if (issues.length || !target || !band || !configuration) throw validationFailed(issues);
    return calculateObservation({ observatory, band, configuration, target, observation: f });
  }

  private async find(
    manager: EntityManager,
    proposalId: string,
    id: string,
  ): Promise<ProposalObservation> {
    const o = isUUID(id) ? await manager.findOneBy(ProposalObservation, { id, proposalId }) : null;
    if (!o) throw notFound('Observation');
    return o;
  }
}
