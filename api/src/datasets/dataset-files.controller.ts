import {
  BadRequestException,
  Body,
  Controller,
  Get,
  Param,
  ParseUUIDPipe,
  Post,
  StreamableFile,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { FileLayout, ImportPreview } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { DatasetFilesService } from './dataset-files.service';
import { PreviewRequestDto } from './datasets.dto';

/** The part of multer's file object the upload reads (memory storage). */
interface UploadedMulterFile {
  originalname: string;
  buffer: Buffer;
}

/** Upload and preview, before anything becomes a dataset version. Guests read only. */
@ApiTags('datasets')
@Controller('labs/:labId/dataset-files')
export class DatasetFilesController {
  constructor(private readonly files: DatasetFilesService) {}

  /** multipart/form-data with one `file` (CSV, TSV or .xlsx) up to UPLOAD_LIMIT_MB; answers the layout and a mapping to confirm. */
  @Roles('pi', 'analyst', 'student')
  @Post()
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file'))
  upload(
    @Param('labId') labId: string,
    @UploadedFile() file: UploadedMulterFile | undefined,
    @CurrentUser() user: AuthUser,
  ): Promise<FileLayout> {
    if (!file) throw new BadRequestException('Send the data file as the multipart field "file"');
    // Browsers send multipart file names as Latin-1 bytes of the UTF-8 name; multer hands them on unchanged.
    const filename = Buffer.from(file.originalname, 'latin1').toString('utf8');
    return this.files.upload(labId, user.id, filename, file.buffer);
  }

  @Roles('pi', 'analyst', 'student')
  @Post(':fileId/preview')
  preview(
    @Param('labId') labId: string,
    @Param('fileId', ParseUUIDPipe) fileId: string,
    @Body() body: PreviewRequestDto,
  ): Promise<ImportPreview> {
    return this.files.preview(labId, fileId, body.mapping);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':fileId/raw')
  async raw(@Param('labId') labId: string, @Param('fileId', ParseUUIDPipe) fileId: string): Promise<StreamableFile> {
    const file = await this.files.withContent(labId, fileId);
    return rawFile(file);
  }
}

export function rawFile(file: { content: Buffer; filename: string; format: string; sha256: string }): StreamableFile {
  return new StreamableFile(file.content, {
    type:
      file.format === 'xlsx'
        ? 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet'
        : 'application/octet-stream',
    disposition: `attachment; filename*=UTF-8''${encodeURIComponent(file.filename)}`,
    length: file.content.length,
  });
}
