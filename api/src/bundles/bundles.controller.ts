import {
  BadRequestException,
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
import type { BundleList, BundleSummary, OpenedBundle } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { BundleRestoreService } from './bundle-restore.service';
import { BundlesService } from './bundles.service';

/** The part of multer's file object the upload reads (memory storage). */
interface UploadedMulterFile {
  originalname: string;
  buffer: Buffer;
}

/** Result bundles: built for a signed-off study by its PI, listed and downloaded, and opened from a file. */
@ApiTags('bundles')
@Controller('labs/:labId')
export class BundlesController {
  constructor(
    private readonly bundles: BundlesService,
    private readonly restore: BundleRestoreService,
  ) {}

  /** Queues the bundle job; follow `runId` like any run. */
  @Roles('pi')
  @Post('studies/:studyId/bundles')
  build(
    @Param('labId') labId: string,
    @Param('studyId', ParseUUIDPipe) studyId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<BundleSummary> {
    return this.bundles.build(labId, studyId, user);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get('studies/:studyId/bundles')
  list(@Param('labId') labId: string, @Param('studyId', ParseUUIDPipe) studyId: string): Promise<BundleList> {
    return this.bundles.list(labId, studyId);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get('bundles/:bundleId')
  get(@Param('labId') labId: string, @Param('bundleId', ParseUUIDPipe) bundleId: string): Promise<BundleSummary> {
    return this.bundles.get(labId, bundleId);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get('bundles/:bundleId/download')
  async download(
    @Param('labId') labId: string,
    @Param('bundleId', ParseUUIDPipe) bundleId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<StreamableFile> {
    const { filename, content } = await this.bundles.download(labId, bundleId, user);
    return new StreamableFile(content, {
      type: 'application/zip',
      disposition: `attachment; filename*=UTF-8''${encodeURIComponent(filename)}`,
      length: content.length,
    });
  }

  /** multipart/form-data with one `file`: a result bundle (.zip). 201 with the restored study; 422 naming each problem. */
  @Roles('pi', 'analyst')
  @Post('bundles/open')
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file'))
  open(
    @Param('labId') labId: string,
    @UploadedFile() file: UploadedMulterFile | undefined,
    @CurrentUser() user: AuthUser,
  ): Promise<OpenedBundle> {
    if (!file) throw new BadRequestException('Send the bundle as the multipart field "file"');
    // Browsers send multipart file names as Latin-1 bytes of the UTF-8 name; multer hands them on unchanged.
    const filename = Buffer.from(file.originalname, 'latin1').toString('utf8');
    return this.restore.open(labId, user, filename, file.buffer);
  }
}
