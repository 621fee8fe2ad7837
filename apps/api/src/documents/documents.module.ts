import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CompiledPdfService } from './compiled-pdf.service.js';
import { ScienceCaseDocument } from './entities/science-case-document.entity.js';
import { ScienceCaseService } from './science-case.service.js';

/** Services only: the proposals module owns the routes and calls these from its use cases. */
@Module({
  imports: [TypeOrmModule.forFeature([ScienceCaseDocument])],
  providers: [ScienceCaseService, CompiledPdfService],
  exports: [ScienceCaseService, CompiledPdfService],
})
export class DocumentsModule {}
