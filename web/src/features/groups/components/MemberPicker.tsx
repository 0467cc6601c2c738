import { Select, Text } from '@mantine/core';
import type { Dataset } from '@provenote/shared/schemas';
import { SampleSelector } from './SampleSelector';

interface Props {
  labId: string;
  datasets: Dataset[];
  versionId: string | null;
  memberIds: string[];
  /** The members to start from when the user picks another dataset version (ids belong to one version). */
  membersFor: (versionId: string | null) => string[];
  onChange: (versionId: string | null, memberIds: string[]) => void;
  versionError?: string;
  membersError?: string;
}

/** A group's members: one reference dataset version, and samples ticked in its table. */
export function MemberPicker({
  labId,
  datasets,
  versionId,
  memberIds,
  membersFor,
  onChange,
  versionError,
  membersError,
}: Props) {
  const versions = datasets.flatMap((d) => d.versions.map((v) => ({ dataset: d, version: v })));
  const chosen = versions.find((v) => v.version.id === versionId);
  return (
    <>
      <Select
        label="Reference data"
        data={versions.map(({ dataset, version }) => ({
          value: version.id,
          label: `${dataset.name} — version ${version.number}`,
        }))}
        value={versionId}
        onChange={(v) => onChange(v, membersFor(v))}
        error={versionError}
      />
      {chosen && (
        <SampleSelector
          labId={labId}
          datasetId={chosen.dataset.id}
          versionNumber={chosen.version.number}
          selected={memberIds}
          onChange={(ids) => onChange(versionId, ids)}
        />
      )}
      {membersError && (
        <Text c="red" size="sm">
          {membersError}
        </Text>
      )}
    </>
  );
}
