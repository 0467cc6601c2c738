import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, Put, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import {
  stepKeySchema,
  type CheckResults,
  type ElementSummary,
  type GroupSizes,
  type Override,
  type Scatter,
  type StepEditResult,
  type Study,
  type StudyList,
} from '@provenote/shared';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { CurrentMembership, CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { CheckResultsService } from './check-results.service';
import { OverridesService } from './overrides.service';
import { SignOffService } from './sign-off.service';
import { StepsService } from './steps.service';
import { StudyRunsService } from './study-runs.service';
import { StudiesService } from './studies.service';
import {
  CheckResultsQueryDto,
  CopyStudyDto,
  CreateOverrideDto,
  CreateStudyDto,
  SignOffDto,
  UpdateStepDto,
  UpdateStudyDto,
} from './studies.dto';

const uuid = new ParseUUIDPipe({ version: '4', errorHttpStatusCode: 404 });

@ApiTags('studies')
@Controller('labs/:labId/studies')
export class StudiesController {
  constructor(
    private readonly studies: StudiesService,
    private readonly steps: StepsService,
    private readonly signOffs: SignOffService,
    private readonly studyRuns: StudyRunsService,
    private readonly overridesService: OverridesService,
    private readonly checkResultsService: CheckResultsService,
  ) {}

  @Roles(...ANY_LAB_ROLE)
  @Get()
  list(@Param('labId') labId: string): Promise<StudyList> {
    return this.studies.list(labId);
  }

  @Roles('pi', 'analyst', 'student')
  @Post()
  create(@Param('labId') labId: string, @Body() body: CreateStudyDto, @CurrentUser() user: AuthUser): Promise<Study> {
    return this.studies.create(labId, body, user);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId')
  get(@Param('labId') labId: string, @Param('studyId', uuid) studyId: string): Promise<Study> {
    return this.studies.get(labId, studyId);
  }

  @Roles('pi', 'analyst', 'student')
  @Patch(':studyId')
  update(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Body() body: UpdateStudyDto,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<Study> {
    return this.studies.update(labId, studyId, body, membership, user);
  }

  @Roles('pi', 'analyst', 'student')
  @Delete(':studyId')
  @HttpCode(204)
  remove(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.studies.remove(labId, studyId, membership, user);
  }

  @Roles('pi', 'analyst', 'student')
  @Post(':studyId/copy')
  copy(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Body() body: CopyStudyDto,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<Study> {
    return this.studies.copy(labId, studyId, body, membership, user);
  }

  @Roles('pi', 'analyst', 'student')
  @Put(':studyId/steps/:stepKey')
  editStep(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Param('stepKey') stepKey: string,
    @Body() body: UpdateStepDto,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<StepEditResult> {
    return this.steps.edit(labId, studyId, stepKeySchema.parse(stepKey), body.parameters, membership, user);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId/element-summary')
  elementSummary(@Param('labId') labId: string, @Param('studyId', uuid) studyId: string): Promise<ElementSummary> {
    return this.steps.elementSummary(labId, studyId);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId/scatter')
  scatter(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    // Checked after the study is found, so another lab's study id is a 404 whatever the query says.
    @Query() query: Record<string, unknown>,
  ): Promise<Scatter> {
    return this.steps.scatter(labId, studyId, query);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId/group-sizes')
  groupSizes(@Param('labId') labId: string, @Param('studyId', uuid) studyId: string): Promise<GroupSizes> {
    return this.steps.groupSizes(labId, studyId);
  }

  @Roles('pi', 'analyst', 'student')
  @Post(':studyId/steps/:stepKey/run')
  startRun(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Param('stepKey') stepKey: string,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<Study> {
    return this.studyRuns.start(labId, studyId, stepKeySchema.parse(stepKey), membership, user);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId/check-results')
  checkResults(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Query() query: CheckResultsQueryDto,
  ): Promise<CheckResults> {
    return this.checkResultsService.get(labId, studyId, query);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':studyId/overrides')
  overrides(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
  ): Promise<{ overrides: Override[] }> {
    return this.overridesService.list(labId, studyId);
  }

  @Roles('pi', 'analyst')
  @Post(':studyId/overrides')
  override(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Body() body: CreateOverrideDto,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<{ overrides: Override[] }> {
    return this.overridesService.create(labId, studyId, body, membership, user);
  }

  @Roles('pi')
  @Post(':studyId/sign-off')
  signOff(
    @Param('labId') labId: string,
    @Param('studyId', uuid) studyId: string,
    @Body() body: SignOffDto,
    @CurrentUser() user: AuthUser,
  ): Promise<Study> {
    return this.signOffs.signOff(labId, studyId, body, user);
  }
}
