import { ApiProperty } from '@nestjs/swagger';
import type { Configuration } from '../entities/configuration.entity.js';
import type { Observatory } from '../entities/observatory.entity.js';
import {
  IEEE_LETTERS,
  type IeeeLetter,
  POLARIZATIONS,
  type Polarization,
  type ReceiverBand,
} from '../entities/receiver-band.entity.js';

/** Field names follow the calculator's ConfigurationSettings, so the record can be passed as is. */
export class ConfigurationResponse {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() shortestBaselineM: number;
  @ApiProperty() longestBaselineM: number;
  @ApiProperty({ example: '2026-09-01' }) inUseFrom: string;
  @ApiProperty({ nullable: true, type: String }) inUseTo: string | null;

  static from(c: Configuration): ConfigurationResponse {
    return {
      id: c.id,
      name: c.name,
      shortestBaselineM: c.shortestBaselineM,
      longestBaselineM: c.longestBaselineM,
      inUseFrom: c.inUseFrom,
      inUseTo: c.inUseTo,
    };
  }
}

/** Field names follow the calculator's BandSettings. */
export class ReceiverBandResponse {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty({ enum: IEEE_LETTERS, nullable: true }) ieeeLetter: IeeeLetter | null;
  @ApiProperty() minGHz: number;
  @ApiProperty() maxGHz: number;
  @ApiProperty() tsysK: number;
  @ApiProperty() apertureEfficiency: number;
  @ApiProperty() maxBandwidthMHz: number;
  @ApiProperty({ enum: POLARIZATIONS, isArray: true }) polarizations: Polarization[];

  static from(b: ReceiverBand): ReceiverBandResponse {
    return {
      id: b.id,
      name: b.name,
      ieeeLetter: b.ieeeLetter,
      minGHz: b.minGHz,
      maxGHz: b.maxGHz,
      tsysK: b.tsysK,
      apertureEfficiency: b.apertureEfficiency,
      maxBandwidthMHz: b.maxBandwidthMHz,
      polarizations: [...b.polarizations].sort(),
    };
  }
}

/** Array fields follow the calculator's ArraySettings (antennas, dishDiameterM …). */
export class ObservatoryResponse {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() latitudeDeg: number;
  @ApiProperty({ description: 'East-positive' }) longitudeDeg: number;
  @ApiProperty() elevationM: number;
  @ApiProperty() elevationLimitDeg: number;
  @ApiProperty() antennas: number;
  @ApiProperty() dishDiameterM: number;
  @ApiProperty() correlatorEfficiency: number;
  @ApiProperty() overheadFraction: number;
  @ApiProperty() beamFactor: number;
  @ApiProperty({ example: 'America/Los_Angeles' }) timeZone: string;
  @ApiProperty({ type: [ConfigurationResponse] }) configurations: ConfigurationResponse[];
  @ApiProperty({ type: [ReceiverBandResponse] }) bands: ReceiverBandResponse[];

  static from(o: Observatory): ObservatoryResponse {
    return {
      id: o.id,
      name: o.name,
      latitudeDeg: o.latitudeDeg,
      longitudeDeg: o.longitudeDeg,
      elevationM: o.elevationM,
      elevationLimitDeg: o.elevationLimitDeg,
      antennas: o.antennas,
      dishDiameterM: o.dishDiameterM,
      correlatorEfficiency: o.correlatorEfficiency,
      overheadFraction: o.overheadFraction,
      beamFactor: o.beamFactor,
      timeZone: o.timeZone,
      configurations: [...(o.configurations ?? [])]
        .sort((a, b) => a.longestBaselineM - b.longestBaselineM || a.name.localeCompare(b.name))
        .map(ConfigurationResponse.from),
      bands: [...(o.bands ?? [])]
        .sort((a, b) => a.minGHz - b.minGHz || a.name.localeCompare(b.name))
        .map(ReceiverBandResponse.from),
    };
  }
}
