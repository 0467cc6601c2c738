import { Readable } from 'node:stream';
import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseIntPipe,
  ParseUUIDPipe,
  Post,
  Query,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Dataset, DatasetVersion, ProblemsPage, RowsPage } from '@provenote/shared';
import type { Response } from 'express';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { CurrentMembership, CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { rawFile } from './dataset-files.controller';
import { DatasetFilesService } from './dataset-files.service';
import { DatasetReadsService } from './dataset-reads.service';
import { versionView } from './dataset-views';
import { CreateDatasetDto, CreateVersionDto, ExportQueryDto, PageQueryDto } from './datasets.dto';
import { DatasetsService } from './datasets.service';

@ApiTags('datasets')
@Controller('labs/:labId/datasets')
export class DatasetsController {
  constructor(
    private readonly datasets: DatasetsService,
    private readonly reads: DatasetReadsService,
    private readonly files: DatasetFilesService,
  ) {}

  /** Imports an uploaded file under its confirmed mapping as version 1 of a new dataset. */
  @Roles('pi', 'analyst', 'student')
  @Post()
  create(
    @Param('labId') labId: string,
    @Body() body: CreateDatasetDto,
    @CurrentUser() user: AuthUser,
    @CurrentMembership() membership: LabMembership,
  ): Promise<Dataset> {
    return this.datasets.create(labId, user, membership.role, body);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get()
  list(@Param('labId') labId: string): Promise<Dataset[]> {
    return this.datasets.list(labId);
  }

  /** The dataset with every version (its file, mapping, columns and counts). */
  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId')
  get(@Param('labId') labId: string, @Param('datasetId', ParseUUIDPipe) datasetId: string): Promise<Dataset> {
    return this.datasets.get(labId, datasetId);
  }

  @Roles('pi', 'analyst', 'student')
  @Post(':datasetId/versions')
  addVersion(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Body() body: CreateVersionDto,
    @CurrentUser() user: AuthUser,
    @CurrentMembership() membership: LabMembership,
  ): Promise<Dataset> {
    return this.datasets.addVersion(labId, datasetId, user, membership.role, body);
  }

  /** One version, including the mapping it was imported under. */
  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId/versions/:number')
  async version(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
  ): Promise<DatasetVersion> {
    return versionView(await this.datasets.version(labId, datasetId, number));
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId/versions/:number/rows')
  async rows(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
    @Query() query: PageQueryDto,
  ): Promise<RowsPage> {
    return this.reads.rows(await this.datasets.version(labId, datasetId, number), query.page, query.pageSize);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId/versions/:number/problems')
  async problems(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
    @Query() query: PageQueryDto,
  ): Promise<ProblemsPage> {
    return this.reads.problems(await this.datasets.version(labId, datasetId, number), query.page, query.pageSize);
  }

  /** The file the version was imported from, byte for byte (its SHA-256 is in the version). */
  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId/versions/:number/raw')
  async raw(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
  ): Promise<StreamableFile> {
    const version = await this.datasets.version(labId, datasetId, number);
    return rawFile(await this.files.withContent(labId, version.fileId));
  }

  /** `?values=original` (as the file gave them; the default) or `?values=ppm`. */
  @Roles(...ANY_LAB_ROLE)
  @Get(':datasetId/versions/:number/export.csv')
  async exportCsv(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
    @Query() query: ExportQueryDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const version = await this.datasets.version(labId, datasetId, number);
    const name = (await this.datasets.get(labId, datasetId)).name.replace(/[^\w.-]+/g, '_');
    res.setHeader('Content-Disposition', `attachment; filename="${name}-v${number}-${query.values}.csv"`);
    return new StreamableFile(Readable.from(this.reads.exportCsv(version, query.values)), {
      type: 'text/csv; charset=utf-8',
    });
  }

  @Roles('pi', 'analyst')
  @Delete(':datasetId')
  @HttpCode(204)
  async remove(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    await this.datasets.remove(labId, datasetId, user);
  }

  @Roles('pi', 'analyst')
  @Delete(':datasetId/versions/:number')
  @HttpCode(204)
  async removeVersion(
    @Param('labId') labId: string,
    @Param('datasetId', ParseUUIDPipe) datasetId: string,
    @Param('number', ParseIntPipe) number: number,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    await this.datasets.remove(labId, datasetId, user, number);
  }
}
