import { Alert, Anchor, Button, FileInput, Stack, Table, Text, Title } from '@mantine/core';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ApiError, errorMessage } from '../../../app/api-client';
import { useOpenBundle } from '../api/bundles';

function Problems({ error }: { error: unknown }) {
  const problems = error instanceof ApiError ? error.errors : [];
  return (
    <Alert color="red" title="This bundle does not verify; nothing was restored">
      <Stack gap="xs">
        <Text size="sm">{errorMessage(error)}</Text>
        {problems.length > 0 && (
          <Table>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>File</Table.Th>
                <Table.Th>Problem</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {problems.map((problem, i) => (
                <Table.Tr key={i}>
                  <Table.Td ff="monospace">{problem.path}</Table.Td>
                  <Table.Td>{problem.message}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        )}
      </Stack>
    </Alert>
  );
}

/** Upload a result bundle: it is verified like `npm run cli -- verify`, then restored as a read-only study. */
export function OpenBundlePage() {
  const { labId = '' } = useParams();
  const [file, setFile] = useState<File | null>(null);
  const open = useOpenBundle(labId);
  return (
    <Stack maw={820} gap="md">
      <Title order={2}>Open a result bundle</Title>
      <Text size="sm">
        Provenote checks every file's SHA-256 against the bundle's manifest and recomputes the results from its inputs.
        Only a bundle that matches throughout is restored, as a signed-off study that cannot be changed.
      </Text>
      <FileInput
        label="Bundle file"
        description="The .zip a Provenote PI exported"
        placeholder="Choose a .zip"
        accept=".zip,application/zip"
        value={file}
        onChange={(chosen) => {
          setFile(chosen);
          open.reset();
        }}
        clearable
      />
      <Button w="fit-content" disabled={!file} loading={open.isPending} onClick={() => file && open.mutate(file)}>
        Verify and open
      </Button>
      {open.error && <Problems error={open.error} />}
      {open.data && (
        <Alert color="teal" title="The bundle verified">
          <Stack gap="xs">
            <Text size="sm">
              {open.data.verification.filesChecked} files matched their checksums and{' '}
              {open.data.verification.valuesCompared} recomputed values matched the bundle's.
            </Text>
            <Anchor component={Link} to={`/labs/${labId}/studies/${open.data.studyId}`}>
              Open the restored study “{open.data.studyName}” (read-only)
            </Anchor>
            <Text size="xs" c="dimmed">
              Its membership probabilities are statistical evidence, not proof of origin.
            </Text>
          </Stack>
        </Alert>
      )}
    </Stack>
  );
}
