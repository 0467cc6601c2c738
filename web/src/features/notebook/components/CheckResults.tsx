import { Alert, Badge, Button, Checkbox, Group, List, Select, Stack, Table, Text, Title } from '@mantine/core';
import { DataTable } from 'mantine-datatable';
import 'mantine-datatable/styles.css';
import { useState } from 'react';
import {
  memberOutcomeLabels,
  memberOutcomes,
  type CheckResults as Results,
  type MemberOutcome,
} from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { formatProbability as fmtP } from '../../../lib/probability';
import { useCheckResults } from '../api/check-results';

/** Short pages keep the notebook readable; a reader who wants more asks for them. */
const PAGE_SIZES = [15, 50, 100];

/** Leave-one-out per member, the confusion table, the separation of each pair and the per-element screening. */
interface Props {
  labId: string;
  studyId: string;
  runId: string;
  /** Given to those who may exclude: each row offers to start an exclusion of its member. */
  onExclude?: (member: { sampleId: string; group: string }) => void;
}

export function CheckResults({ labId, studyId, runId, onExclude }: Props) {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(PAGE_SIZES[0]);
  const [outcome, setOutcome] = useState<MemberOutcome | null>(null);
  const [group, setGroup] = useState<string | null>(null);
  const [flaggedOnly, setFlaggedOnly] = useState(false);
  const results = useCheckResults(labId, studyId, runId, {
    page,
    pageSize,
    outcome: outcome ?? undefined,
    group: group ?? undefined,
    flaggedByRobustFit: flaggedOnly || undefined,
  });
  if (results.isError) return <Alert color="red">Could not load the group check: {errorMessage(results.error)}</Alert>;
  const data = results.data;
  if (!data) return <Text size="sm">Loading the group check…</Text>;
  return (
    <Stack gap="md">
      <Text size="sm">
        {data.returnedToOwnGroup} of {data.memberCount} members return to their own group when left out of it.
      </Text>
      <Confusion data={data} />
      <Title order={4}>Members left out one at a time</Title>
      <Group grow>
        <Select
          label="Outcome"
          data={memberOutcomes.map((o) => ({ value: o, label: memberOutcomeLabels[o] }))}
          value={outcome}
          onChange={(o) => {
            setPage(1);
            setOutcome(o as MemberOutcome | null);
          }}
          clearable
        />
        <Select
          label="Group"
          data={data.groups.map((g) => g.name)}
          value={group}
          onChange={(g) => {
            setPage(1);
            setGroup(g);
          }}
          clearable
        />
        <Checkbox
          label="Flagged by robust fit"
          description="Only members far from the bulk of their group"
          checked={flaggedOnly}
          onChange={(e) => {
            setPage(1);
            setFlaggedOnly(e.currentTarget.checked);
          }}
        />
      </Group>
      <RobustFitNotes data={data} />
      <DataTable
        aria-label="Leave-one-out results per member"
        withTableBorder
        striped
        minHeight={150}
        idAccessor={(r) => `${r.group}/${r.sampleId}`}
        records={data.members.rows}
        fetching={results.isFetching}
        totalRecords={data.members.total}
        recordsPerPage={data.members.pageSize}
        recordsPerPageOptions={PAGE_SIZES}
        recordsPerPageLabel="Members per page"
        onRecordsPerPageChange={(size) => {
          setPage(1);
          setPageSize(size);
        }}
        page={page}
        onPageChange={setPage}
        noRecordsText="No members match"
        // Ids and numbers keep to one line and the table scrolls sideways instead; the Exclude column stays
        // pinned at the right edge so it can be reached at laptop width.
        pinLastColumn={onExclude !== undefined}
        columns={[
          { accessor: 'sampleId', title: 'Sample', noWrap: true },
          { accessor: 'group', title: 'Group' },
          { accessor: 'outcome', title: 'Left out', render: (r) => memberOutcomeLabels[r.outcome] },
          { accessor: 'bestGroup', title: 'Best group' },
          {
            accessor: 'd2LeaveOneOut',
            noWrap: true,
            title: 'D² left out',
            textAlign: 'right',
            render: (r) => r.d2LeaveOneOut.toFixed(2),
          },
          {
            accessor: 'pHotellingLeaveOneOut',
            noWrap: true,
            title: 'p (Hotelling)',
            textAlign: 'right',
            render: (r) => fmtP(r.pHotellingLeaveOneOut),
          },
          {
            accessor: 'pChi2LeaveOneOut',
            noWrap: true,
            title: 'p (χ²)',
            textAlign: 'right',
            render: (r) => fmtP(r.pChi2LeaveOneOut),
          },
          {
            accessor: 'flaggedByRobustFit',
            title: 'Robust fit',
            noWrap: true,
            render: (r) =>
              r.robustD2 === null ? (
                <Text size="xs" c="dimmed">
                  none
                </Text>
              ) : (
                <Group gap={6} wrap="nowrap">
                  <Text size="sm">D² {r.robustD2.toFixed(2)}</Text>
                  {r.flaggedByRobustFit && (
                    <Badge color="orange" variant="light" miw="max-content">
                      Flagged
                    </Badge>
                  )}
                </Group>
              ),
          },
          ...(onExclude
            ? [
                {
                  accessor: 'exclude',
                  title: 'Exclude',
                  noWrap: true,
                  render: (r: Row) => (
                    <Button
                      size="compact-xs"
                      variant="subtle"
                      aria-label={`Exclude ${r.sampleId} from ${r.group}`}
                      onClick={() => onExclude({ sampleId: r.sampleId, group: r.group })}
                    >
                      Exclude…
                    </Button>
                  ),
                },
              ]
            : []),
        ]}
      />
      <Title order={4}>Separation of the groups (two-sample Hotelling T²)</Title>
      <Table aria-label="Pairwise separation">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Groups</Table.Th>
            <Table.Th ta="right">T²</Table.Th>
            <Table.Th ta="right">F (df)</Table.Th>
            <Table.Th ta="right">p</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {data.pairs.map((pair) => (
            <Table.Tr key={`${pair.groupA}/${pair.groupB}`}>
              <Table.Td>
                {pair.groupA} – {pair.groupB}
              </Table.Td>
              <Table.Td ta="right">{pair.t2.toFixed(2)}</Table.Td>
              <Table.Td ta="right">
                {pair.f.toFixed(2)} ({pair.df1}, {pair.df2})
              </Table.Td>
              <Table.Td ta="right">{fmtP(pair.p)}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      <Title order={4}>Screening per coordinate (Kruskal–Wallis H)</Title>
      <Text size="xs" c="dimmed">
        A large H (small p) means the groups differ in that coordinate: it helps tell them apart.
      </Text>
      <Table aria-label="Kruskal–Wallis screening">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Coordinate</Table.Th>
            <Table.Th ta="right">H</Table.Th>
            <Table.Th ta="right">p</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {data.kruskalWallis.map((k) => (
            <Table.Tr key={k.variable}>
              <Table.Td>{k.variable}</Table.Td>
              <Table.Td ta="right">{k.h.toFixed(2)}</Table.Td>
              <Table.Td ta="right">{fmtP(k.p)}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Stack>
  );
}

type Row = Results['members']['rows'][number];

/** What the robust flags mean, and which groups have none and why. */
function RobustFitNotes({ data }: { data: Results }) {
  if (data.robustFit.length === 0) return null;
  const unfitted = data.robustFit.filter((r) => r.note !== null);
  const seeds = [...new Set(data.robustFit.map((r) => r.seed))].join(', ');
  return (
    <Stack gap={4}>
      <Text size="xs" c="dimmed">
        Robust fit: each group is refitted by FAST-MCD (seed {seeds}); a member is flagged when its robust D² exceeds
        the 97.5 % point of robust D² in simulated clean groups of the same size and dimension, so about one member in
        forty of a clean group is flagged. A flag is statistical evidence that a member lies apart from its group, not
        proof that its source is wrong: check its record before excluding it.
      </Text>
      {unfitted.length > 0 && (
        <List size="sm">
          {unfitted.map((r) => (
            <List.Item key={r.group}>
              {r.group}: {r.note}
            </List.Item>
          ))}
        </List>
      )}
    </Stack>
  );
}

function Confusion({ data }: { data: Results }) {
  const names = data.groups.map((g) => g.name);
  const columns = [...names, 'ambiguous', 'unassigned'];
  return (
    <Table aria-label="Where members go when left out" withColumnBorders>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Own group ↓ / assigned to →</Table.Th>
          {columns.map((c) => (
            <Table.Th key={c} ta="right">
              {c}
            </Table.Th>
          ))}
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {names.map((own) => (
          <Table.Tr key={own}>
            <Table.Td>{own}</Table.Td>
            {columns.map((c) => (
              <Table.Td key={c} ta="right" fw={c === own ? 700 : undefined}>
                {data.confusion[own]?.[c] ?? 0}
              </Table.Td>
            ))}
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
