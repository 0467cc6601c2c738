import { Body, Controller, Get, type MessageEvent, Param, ParseUUIDPipe, Post, Query, Sse } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { concat, defer, finalize, from, map, type Observable, of, ReplaySubject, switchMap, takeWhile } from 'rxjs';
import {
  isFinishedRunStatus,
  type AssignmentsPage,
  type CreateRunRequest,
  type Run,
  type RunEvent,
  type RunList,
} from '@provenote/shared';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { CurrentMembership, CurrentUser } from '../auth/current-user.decorator';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { AssignmentsService } from './assignments.service';
import { RunEventsRelay } from './run-events.relay';
import { runToEvent } from './run.mapper';
import { AssignmentsQueryDto, createRunBodyPipe } from './runs.dto';
import { RunsService } from './runs.service';

@ApiTags('runs')
@Controller('labs/:labId/runs')
export class RunsController {
  constructor(
    private readonly runs: RunsService,
    private readonly assignments: AssignmentsService,
    private readonly relay: RunEventsRelay,
  ) {}

  /** Starts a run; the role check per kind is in the service. */
  @Roles('pi', 'analyst', 'student')
  @Post()
  create(
    @Param('labId') labId: string,
    @CurrentUser() user: AuthUser,
    @CurrentMembership() membership: LabMembership,
    @Body(createRunBodyPipe) body: CreateRunRequest,
  ): Promise<Run> {
    return this.runs.create(labId, user.id, membership.role, body);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get()
  async list(@Param('labId') labId: string): Promise<RunList> {
    return { runs: await this.runs.list(labId) };
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':runId')
  get(@Param('labId') labId: string, @Param('runId', ParseUUIDPipe) runId: string): Promise<Run> {
    return this.runs.get(labId, runId);
  }

  @Roles('pi', 'analyst', 'student')
  @Post(':runId/cancel')
  cancel(@Param('labId') labId: string, @Param('runId', ParseUUIDPipe) runId: string): Promise<Run> {
    return this.runs.cancel(labId, runId);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':runId/assignments')
  assignmentsPage(
    @Param('labId') labId: string,
    @Param('runId', ParseUUIDPipe) runId: string,
    @Query() query: AssignmentsQueryDto,
  ): Promise<AssignmentsPage> {
    return this.assignments.page(labId, runId, query);
  }

  /**
   * Server-sent events: the run's state now, then every change until it ends. Live events are buffered
   * while the current state is read, so none is lost between the two.
   */
  @Roles(...ANY_LAB_ROLE)
  @Sse(':runId/events')
  async events(
    @Param('labId') labId: string,
    @Param('runId', ParseUUIDPipe) runId: string,
  ): Promise<Observable<MessageEvent>> {
    // Looked up before the stream opens, so another lab's run id is a 404 rather than a 200 stream with an error event.
    await this.runs.get(labId, runId);
    return defer(() => {
      const live = new ReplaySubject<RunEvent>();
      const subscription = this.relay.events(runId).subscribe(live);
      return from(this.runs.get(labId, runId)).pipe(
        switchMap((run) => concat(of(runToEvent(run)), live)),
        finalize(() => subscription.unsubscribe()),
      );
    }).pipe(
      takeWhile((event) => !isFinishedRunStatus(event.status), true),
      map((event): MessageEvent => ({ type: 'run', data: event })),
    );
  }
}
