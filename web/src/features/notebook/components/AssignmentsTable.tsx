import { Badge, Button, Group, Select, Tabs, Text, TextInput, Tooltip } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { DataTable, type DataTableSortStatus } from 'mantine-datatable';
import 'mantine-datatable/styles.css';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { assignmentVerdicts, type AssignmentRow, type AssignmentsQuery } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { formatOptionalProbability as formatP } from '../../../lib/probability';
import { assignmentsQuery, useAssignments } from '../api/assignments';
import { BivariatePlot } from '../../plots/components/BivariatePlot';
import { ProbabilityHeatmap } from '../../plots/components/ProbabilityHeatmap';
import { ProjectionPlot } from '../../plots/components/ProjectionPlot';
import { AssignmentDrawer } from './AssignmentDrawer';

/** The verdict that stands: the analyst's override where there is one, its reason on hover. */
function FinalVerdict({ row }: { row: AssignmentRow }) {
  if (!row.override) return <Text size="sm">{row.verdict}</Text>;
  const group = row.override.group ? ` (${row.override.group})` : '';
  return (
    <Tooltip label={`Reason: ${row.override.reason}`} multiline maw={320} withArrow>
      <Group gap={6} wrap="nowrap" title={`Overridden — reason: ${row.override.reason}`}>
        <Text size="sm" fw={600}>
          {row.override.verdict}
          {group}
        </Text>
        <Badge size="xs" variant="light" color="grape">
          overridden
        </Badge>
      </Group>
    </Tooltip>
  );
}
const sortable = new Set<string>(['sampleId', 'verdict', 'group', 'probability', 'runnerUpProbability']);

/** The unknowns of one assign run: server-side paging, sorting, filtering and search (100,000 rows and more). */
interface Props {
  labId: string;
  studyId: string;
  runId: string;
  canOverride: boolean;
  basis: 'chi2' | 'hotelling';
  /** The study's chosen elements, for the two-element plot. */
  elements: string[];
}

/** Short pages keep the notebook readable; the heat map draws the whole run on its own. */
const PAGE_SIZES = [20, 50, 100];

export function AssignmentsTable({ labId, studyId, runId, canOverride, basis, elements }: Props) {
  const queryClient = useQueryClient();
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(PAGE_SIZES[0]);
  const [verdict, setVerdict] = useState<string | null>(null);
  const [group, setGroup] = useState<string | null>(null);
  const [search, setSearch] = useState('');
  const [debouncedSearch] = useDebouncedValue(search.trim(), 300);
  const [sortStatus, setSortStatus] = useState<DataTableSortStatus<AssignmentRow>>({
    columnAccessor: 'sampleId',
    direction: 'asc',
  });
  const [open, setOpen] = useState<AssignmentRow | null>(null);
  const results = useAssignments(labId, runId, {
    page,
    pageSize,
    sort: sortable.has(String(sortStatus.columnAccessor))
      ? (sortStatus.columnAccessor as AssignmentsQuery['sort'])
      : 'input',
    order: sortStatus.direction,
    finalVerdict: (verdict ?? undefined) as AssignmentsQuery['finalVerdict'],
    group: group ?? undefined,
    search: debouncedSearch || undefined,
  });
  const data = results.data;
  /** Opens the detail drawer for a sample clicked in a plot (it may be on another results page). */
  const openSample = async (sampleId: string) => {
    // Sorted by id, the exact id comes first among the ids it starts.
    const found = await queryClient.fetchQuery(
      assignmentsQuery(labId, runId, { page: 1, search: sampleId, sort: 'sampleId', order: 'asc' }),
    );
    const row = found.rows.find((r) => r.sampleId === sampleId);
    if (row) setOpen(row);
  };
  const resetPage =
    <T,>(set: (v: T) => void) =>
    (v: T) => {
      setPage(1);
      set(v);
    };

  return (
    <>
      <Group grow>
        <TextInput
          label="Search"
          placeholder="Sample id starts with…"
          value={search}
          onChange={(e) => resetPage(setSearch)(e.currentTarget.value)}
        />
        <Select
          label="Final verdict"
          data={[...assignmentVerdicts]}
          value={verdict}
          onChange={resetPage(setVerdict)}
          clearable
        />
        <Select
          label="Group"
          data={data?.groups.map((g) => g.name) ?? []}
          value={group}
          onChange={resetPage(setGroup)}
          clearable
        />
      </Group>
      <Tabs defaultValue="table" keepMounted={false}>
        <Tabs.List>
          <Tabs.Tab value="table">Table</Tabs.Tab>
          <Tabs.Tab value="heatmap">Probability heat map</Tabs.Tab>
          <Tabs.Tab value="bivariate">Two elements</Tabs.Tab>
          <Tabs.Tab value="projection">Projection</Tabs.Tab>
        </Tabs.List>
        <Tabs.Panel value="projection" pt="xs">
          <ProjectionPlot
            labId={labId}
            runId={runId}
            groupOrder={data?.groups.map((g) => g.name) ?? []}
            onOpenUnknown={openSample}
          />
        </Tabs.Panel>
        <Tabs.Panel value="bivariate" pt="xs">
          <BivariatePlot
            labId={labId}
            studyId={studyId}
            elements={elements}
            groupOrder={data?.groups.map((g) => g.name) ?? []}
            onOpenUnknown={openSample}
          />
        </Tabs.Panel>
        <Tabs.Panel value="heatmap" pt="xs">
          <ProbabilityHeatmap labId={labId} runId={runId} initialBasis={basis} onOpenUnknown={openSample} />
        </Tabs.Panel>
        <Tabs.Panel value="table" pt="xs">
          <DataTable<AssignmentRow>
            aria-label="Assignments of the unknowns"
            withTableBorder
            striped
            highlightOnHover
            minHeight={200}
            idAccessor="sampleId"
            records={data?.rows ?? []}
            fetching={results.isFetching}
            totalRecords={data?.total ?? 0}
            recordsPerPage={data?.pageSize ?? pageSize}
            recordsPerPageOptions={PAGE_SIZES}
            recordsPerPageLabel="Unknowns per page"
            onRecordsPerPageChange={(size) => {
              setPage(1);
              setPageSize(size);
            }}
            page={page}
            onPageChange={setPage}
            sortStatus={sortStatus}
            onSortStatusChange={(s) => {
              setPage(1);
              setSortStatus(s);
            }}
            noRecordsText={
              results.isError ? `Could not load the results: ${errorMessage(results.error)}` : 'No unknowns match'
            }
            onRowClick={({ record }) => setOpen(record)}
            columns={[
              {
                accessor: 'details',
                title: '',
                render: (r) => (
                  <Button
                    size="compact-xs"
                    variant="subtle"
                    aria-label={`Details of ${r.sampleId}`}
                    onClick={(event) => {
                      // The row's own click opens the drawer too; one opening is enough.
                      event.stopPropagation();
                      setOpen(r);
                    }}
                  >
                    Details
                  </Button>
                ),
              },
              { accessor: 'sampleId', title: 'Sample', sortable: true },
              { accessor: 'verdict', title: 'Computed verdict', sortable: true, noWrap: true },
              { accessor: 'final', title: 'Final', noWrap: true, render: (r) => <FinalVerdict row={r} /> },
              { accessor: 'group', title: 'Best group', sortable: true, noWrap: true },
              {
                accessor: 'probability',
                title: 'Probability',
                sortable: true,
                textAlign: 'right',
                render: (r) => formatP(r.probability),
              },
              { accessor: 'runnerUp', title: 'Runner-up', noWrap: true, render: (r) => r.runnerUp ?? '—' },
              {
                accessor: 'runnerUpProbability',
                title: 'Runner-up probability',
                sortable: true,
                noWrap: true,
                textAlign: 'right',
                render: (r) => formatP(r.runnerUpProbability),
              },
              ...(data?.groups ?? []).map((g, i) => ({
                accessor: `d2-${g.name}`,
                title: `D² ${g.name}`,
                textAlign: 'right' as const,
                render: (r: AssignmentRow) => r.d2[i].toFixed(2),
              })),
            ]}
          />
        </Tabs.Panel>
      </Tabs>
      {data && (
        <AssignmentDrawer
          labId={labId}
          studyId={studyId}
          canOverride={canOverride}
          row={open}
          groups={data.groups}
          variables={data.variables}
          onClose={() => setOpen(null)}
        />
      )}
    </>
  );
}
