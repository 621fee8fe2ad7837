import { PartialType } from '@nestjs/swagger';
import { CreateObservatoryDto } from './create-observatory.dto.js';

export class UpdateObservatoryDto extends PartialType(CreateObservatoryDto) {}
