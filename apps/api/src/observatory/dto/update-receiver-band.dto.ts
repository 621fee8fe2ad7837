import { PartialType } from '@nestjs/swagger';
import { CreateReceiverBandDto } from './create-receiver-band.dto.js';

export class UpdateReceiverBandDto extends PartialType(CreateReceiverBandDto) {}
