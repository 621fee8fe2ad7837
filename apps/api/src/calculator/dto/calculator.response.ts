import { ApiProperty } from '@nestjs/swagger';
import {
  CHECK_CODES,
  type Check,
  type CheckCode,
  type CheckLevel,
  type ObservationResult,
} from '@skyhours/calc';

export class CheckResponse {
  @ApiProperty({ enum: ['blocker', 'warning', 'note'] })
  level: CheckLevel;

  @ApiProperty({ enum: CHECK_CODES })
  code: CheckCode;

  @ApiProperty({ example: 'target.decDeg', description: 'The input path the finding is about' })
  field: string;

  @ApiProperty({ description: 'A sentence with the numbers' })
  message: string;

  static from({ level, code, field, message }: Check): CheckResponse {
    return { level, code, field, message };
  }
}

const nullable = (description: string) =>
  ApiProperty({ type: Number, nullable: true, description });

/** Every number of SCIENCE.md for one observation; a number that does not apply is null. */
export class CalculatorResponse {
  @ApiProperty({ example: 1.4 })
  skyFrequencyGHz: number;

  @ApiProperty()
  wavelengthM: number;

  @ApiProperty({ description: 'λ / B_longest' })
  resolutionArcsec: number;

  @ApiProperty({ description: '0.6 λ / B_shortest' })
  largestScaleArcsec: number;

  @ApiProperty({ description: 'beamFactor · λ / D' })
  primaryBeamArcmin: number;

  @ApiProperty({ description: 'Mosaic pointings to cover the target' })
  pointings: number;

  @ApiProperty()
  effectiveAreaM2: number;

  @ApiProperty()
  sefdJy: number;

  @nullable('Image rms reached in onSourceHours; null without onSourceHours')
  rmsMicroJy: number | null;

  @nullable('On-source hours per pointing that reach rmsGoalMicroJy; null without a goal')
  onSourceHoursForGoal: number | null;

  @nullable('On-source hours (else the goal’s) · pointings · (1 + overhead)')
  totalHours: number | null;

  @nullable('Brightness-temperature rms in the synthesised beam')
  brightnessRmsK: number | null;

  @ApiProperty()
  maxElevationDeg: number;

  @ApiProperty({ description: 'Sidereal hours per day above the elevation limit' })
  hoursAboveLimit: number;

  @nullable('LST of rising through the limit; null when it never rises or never sets')
  lstRiseHours: number | null;

  @nullable('LST of setting through the limit; null when it never rises or never sets')
  lstSetHours: number | null;

  @ApiProperty({ type: [CheckResponse], description: 'Blockers first, then warnings, then notes' })
  checks: CheckResponse[];

  static from(r: ObservationResult): CalculatorResponse {
    return {
      skyFrequencyGHz: r.skyFrequencyGHz,
      wavelengthM: r.wavelengthM,
      resolutionArcsec: r.resolutionArcsec,
      largestScaleArcsec: r.largestScaleArcsec,
      primaryBeamArcmin: r.primaryBeamArcmin,
      pointings: r.pointings,
      effectiveAreaM2: r.effectiveAreaM2,
      sefdJy: r.sefdJy,
      rmsMicroJy: r.rmsMicroJy,
      onSourceHoursForGoal: r.onSourceHoursForGoal,
      totalHours: r.totalHours,
      brightnessRmsK: r.brightnessRmsK,
      maxElevationDeg: r.maxElevationDeg,
      hoursAboveLimit: r.hoursAboveLimit,
      lstRiseHours: r.lstRiseHours,
      lstSetHours: r.lstSetHours,
      checks: r.checks.map((check) => CheckResponse.from(check)),
    };
  }
}
