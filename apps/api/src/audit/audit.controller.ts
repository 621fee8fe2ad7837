import { Controller, Get, Query } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Roles } from '../common/decorators/roles.decorator.js';
import { AuditService } from './audit.service.js';
import { AuditPageResponse } from './dto/audit-event.response.js';
import { ListAuditQuery } from './dto/list-audit.query.js';

@ApiTags('audit')
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Roles('admin')
  @Get()
  @ApiOkResponse({ type: AuditPageResponse })
  async list(@Query() query: ListAuditQuery): Promise<AuditPageResponse> {
    const { items, total } = await this.audit.list(query);
    return { items, total, page: query.page, pageSize: query.pageSize };
  }
}
