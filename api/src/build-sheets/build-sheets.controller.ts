import { requestWords } from '@loomwright/shared';
import { Controller, Get, Header, Param, StreamableFile } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiNotFoundResponse, ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { AuthUser } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { PDF_CONTENT_SECURITY_POLICY } from '../security/security-headers';
import { BuildSheetsService } from './build-sheets.service';

@ApiTags('build sheets')
@Controller('bookings')
export class BuildSheetsController {
  constructor(private readonly buildSheets: BuildSheetsService) {}

  @Roles('builder', 'owner')
  @ApiOperation({ summary: 'A build’s printable build sheet' })
  @Get(':id/build-sheet')
  @ApiProduces('application/pdf')
  @Header('Content-Security-Policy', PDF_CONTENT_SECURITY_POLICY)
  @ApiOkResponse({
    description:
      'A printable PDF: signal chain, loops, power, cable schedule, functions, notes, bench cautions, and the money (quote lines, extras, payments and refunds, balance due, from the same money facts as the booking).',
  })
  @ApiNotFoundResponse({ description: 'No such booking, or it has no quote yet.' })
  async buildSheet(@CurrentUser() user: AuthUser, @Param('id', uuidParam(requestWords.notAnId('a booking'))) id: string) {
    const { reference, pdf } = await this.buildSheets.render(id, user);
    return new StreamableFile(pdf, {
      type: 'application/pdf',
      disposition: `inline; filename="build-sheet-${reference}.pdf"`,
      length: pdf.length,
    });
  }
}
