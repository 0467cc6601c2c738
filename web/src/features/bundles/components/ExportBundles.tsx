import { Alert, Anchor, Badge, Button, Group, Stack, Table, Text } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { BundleSummary } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { RunProgress } from '../../runs/components/RunProgress';
import { bundleDownloadUrl, useBuildBundle, useBundles } from '../api/bundles';

const sizeText = (bytes: number | null) =>
  bytes === null
    ? ''
    : bytes < 1024 * 1024
      ? `${(bytes / 1024).toFixed(1)} kB`
      : `${(bytes / 1024 ** 2).toFixed(1)} MB`;

/** A badge clips its label by default; in a squeezed table column that hid the origin ("BUILT H…"). */
const FULL_BADGE = { root: { overflow: 'visible' }, label: { overflow: 'visible', textOverflow: 'clip' } } as const;

function BundleRow({ labId, bundle }: { labId: string; bundle: BundleSummary }) {
  const ready = bundle.status === 'succeeded' && bundle.sizeBytes !== null;
  return (
    <Table.Tr>
      <Table.Td>{new Date(bundle.createdAt).toLocaleString()}</Table.Td>
      <Table.Td>{bundle.createdBy ?? '—'}</Table.Td>
      <Table.Td>
        <Badge variant="light" color={bundle.origin === 'built' ? 'blue' : 'grape'} styles={FULL_BADGE}>
          {bundle.origin === 'built' ? 'built here' : 'opened from a file'}
        </Badge>
      </Table.Td>
      <Table.Td>
        {ready ? (
          <Anchor
            href={bundleDownloadUrl(labId, bundle.id)}
            download={bundle.filename}
            style={{ wordBreak: 'break-all' }}
          >
            {bundle.filename}
          </Anchor>
        ) : bundle.status === 'failed' ? (
          <Text size="sm" c="red">
            Failed: {bundle.error ?? 'no reason was recorded'}
          </Text>
        ) : (
          <Text size="sm" c="dimmed">
            Being built…
          </Text>
        )}
      </Table.Td>
      <Table.Td>{sizeText(bundle.sizeBytes)}</Table.Td>
      <Table.Td>
        {bundle.sha256 && (
          <Text size="xs" ff="monospace" title={bundle.sha256}>
            {bundle.sha256.slice(0, 12)}…
          </Text>
        )}
      </Table.Td>
    </Table.Tr>
  );
}

/**
 * The Export card's content: the PI builds a result bundle of the signed-off study (progress from its
 * run), and anyone in the lab downloads the earlier ones.
 */
export function ExportBundles({
  labId,
  studyId,
  signedOff,
  isPi,
}: {
  labId: string;
  studyId: string;
  signedOff: boolean;
  isPi: boolean;
}) {
  const { data, error, isPending } = useBundles(labId, studyId);
  const build = useBuildBundle(labId, studyId);
  const bundles = data?.bundles ?? [];
  const building = bundles.find((b) => b.origin === 'built' && (b.status === 'queued' || b.status === 'running'));
  const blocked = !signedOff
    ? 'Sign the study off on the Review card first: a bundle records a finished classification.'
    : !isPi
      ? "Only the lab's PI can build a bundle."
      : null;
  return (
    <Stack gap="sm">
      <Text size="sm">
        A result bundle is a zip with the raw and prepared inputs, each group's members, mean and covariance, every
        result with the reviewed verdicts, an offline report and a SHA-256 for every file. Anyone can check it without
        Provenote: <code>npm run cli -- verify BUNDLE.zip</code> recomputes the results from the inputs.
      </Text>
      <Text size="xs" c="dimmed">
        The membership probabilities in a bundle are statistical evidence of how typical a sample is of a group, not
        proof of its origin.
      </Text>
      <Group>
        <Button
          w="fit-content"
          disabled={blocked !== null || building !== undefined}
          loading={build.isPending}
          onClick={() => build.mutate()}
        >
          Build a result bundle
        </Button>
        <Anchor component={Link} to={`/labs/${labId}/bundles/open`} size="sm">
          Open a bundle from a file
        </Anchor>
      </Group>
      {blocked && (
        <Text size="sm" c="dimmed">
          {blocked}
        </Text>
      )}
      {build.error && (
        <Alert color="red" title="The bundle could not be started">
          {errorMessage(build.error)}
        </Alert>
      )}
      {building?.runId && <RunProgress labId={labId} runId={building.runId} />}
      {error && (
        <Alert color="red" title="The bundles could not be listed">
          {errorMessage(error)}
        </Alert>
      )}
      {!isPending && !error && bundles.length === 0 && (
        <Text size="sm" c="dimmed">
          No bundles of this study yet.
        </Text>
      )}
      {bundles.length > 0 && (
        <Table.ScrollContainer minWidth={640}>
          <Table>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Made</Table.Th>
                <Table.Th>By</Table.Th>
                <Table.Th>Origin</Table.Th>
                <Table.Th>File</Table.Th>
                <Table.Th>Size</Table.Th>
                <Table.Th>SHA-256</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {bundles.map((bundle) => (
                <BundleRow key={bundle.id} labId={labId} bundle={bundle} />
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
    </Stack>
  );
}
