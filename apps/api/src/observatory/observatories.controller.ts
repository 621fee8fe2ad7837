import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CreateConfigurationDto } from './dto/create-configuration.dto.js';
import { CreateObservatoryDto } from './dto/create-observatory.dto.js';
import { CreateReceiverBandDto } from './dto/create-receiver-band.dto.js';
import {
  ConfigurationResponse,
  ObservatoryResponse,
  ReceiverBandResponse,
} from './dto/observatory.response.js';
import { UpdateConfigurationDto } from './dto/update-configuration.dto.js';
import { UpdateObservatoryDto } from './dto/update-observatory.dto.js';
import { UpdateReceiverBandDto } from './dto/update-receiver-band.dto.js';
import { ObservatoryService } from './observatory.service.js';

/** The array's description: anyone may read it (the calculator needs it); staff change it. */
@ApiTags('observatories')
@Controller('observatories')
export class ObservatoriesController {
  constructor(private readonly observatories: ObservatoryService) {}

  @Public()
  @Get()
  @ApiOkResponse({ type: [ObservatoryResponse] })
  async list(): Promise<ObservatoryResponse[]> {
    return (await this.observatories.list()).map(ObservatoryResponse.from);
  }

  @Public()
  @Get(':id')
  @ApiOkResponse({ type: ObservatoryResponse })
  async get(@Param('id') id: string): Promise<ObservatoryResponse> {
    return ObservatoryResponse.from(await this.observatories.get(id));
  }

  @Roles('staff')
  @Post()
  @ApiCreatedResponse({ type: ObservatoryResponse })
  async create(
    @Body() dto: CreateObservatoryDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ObservatoryResponse> {
    return ObservatoryResponse.from(await this.observatories.create(dto, user));
  }

  @Roles('staff')
  @Patch(':id')
  @ApiOkResponse({ type: ObservatoryResponse })
  async update(
    @Param('id') id: string,
    @Body() dto: UpdateObservatoryDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ObservatoryResponse> {
    return ObservatoryResponse.from(await this.observatories.update(id, dto, user));
  }

  @Public()
  @Get(':id/configurations')
  @ApiOkResponse({ type: [ConfigurationResponse] })
  async configurations(@Param('id') id: string): Promise<ConfigurationResponse[]> {
    return ObservatoryResponse.from(await this.observatories.get(id)).configurations;
  }

  @Roles('staff')
  @Post(':id/configurations')
  @ApiCreatedResponse({ type: ConfigurationResponse })
  async addConfiguration(
    @Param('id') id: string,
    @Body() dto: CreateConfigurationDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ConfigurationResponse> {
    return ConfigurationResponse.from(await this.observatories.addConfiguration(id, dto, user));
  }

  @Roles('staff')
  @Patch(':id/configurations/:configurationId')
  @ApiOkResponse({ type: ConfigurationResponse })
  async updateConfiguration(
    @Param('id') id: string,
    @Param('configurationId') configurationId: string,
    @Body() dto: UpdateConfigurationDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ConfigurationResponse> {
    return ConfigurationResponse.from(
      await this.observatories.updateConfiguration(id, configurationId, dto, user),
    );
  }

  @Roles('staff')
  @Delete(':id/configurations/:configurationId')
  @HttpCode(204)
  async removeConfiguration(
    @Param('id') id: string,
    @Param('configurationId') configurationId: string,
    @CurrentUser() user: SessionUser,
  ): Promise<void> {
    await this.observatories.removeConfiguration(id, configurationId, user);
  }

  @Public()
  @Get(':id/bands')
  @ApiOkResponse({ type: [ReceiverBandResponse] })
  async bands(@Param('id') id: string): Promise<ReceiverBandResponse[]> {
    return ObservatoryResponse.from(await this.observatories.get(id)).bands;
  }

  @Roles('staff')
  @Post(':id/bands')
  @ApiCreatedResponse({ type: ReceiverBandResponse })
  async addBand(
    @Param('id') id: string,
    @Body() dto: CreateReceiverBandDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ReceiverBandResponse> {
    return ReceiverBandResponse.from(await this.observatories.addBand(id, dto, user));
  }

  @Roles('staff')
  @Patch(':id/bands/:bandId')
  @ApiOkResponse({ type: ReceiverBandResponse })
  async updateBand(
    @Param('id') id: string,
    @Param('bandId') bandId: string,
    @Body() dto: UpdateReceiverBandDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ReceiverBandResponse> {
    return ReceiverBandResponse.from(await this.observatories.updateBand(id, bandId, dto, user));
  }

  @Roles('staff')
  @Delete(':id/bands/:bandId')
  @HttpCode(204)
  async removeBand(
    @Param('id') id: string,
    @Param('bandId') bandId: string,
    @CurrentUser() user: SessionUser,
  ): Promise<void> {
    await this.observatories.removeBand(id, bandId, user);
  }
}
