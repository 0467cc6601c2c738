import { Alert, List, Stack, Text } from '@mantine/core';
import type { GroupSizes } from '@provenote/shared/schemas';

interface Props {
  sizes: GroupSizes;
  /** The Assign card's probability basis: the χ² rule's excess rejections matter only on that basis. */
  basis: 'hotelling' | 'chi2';
}

const percent = (rate: number | null) => (rate === null ? '—' : `${(100 * rate).toFixed(1)} %`);

/** The engine's size assessment in plain words: which groups are small and why, and when χ² misleads. */
export function GroupSizeAlerts({ sizes, basis }: Props) {
  const small = sizes.groups.filter((g) => g.status !== 'ok');
  const overRejecting = basis === 'chi2' ? sizes.groups.filter((g) => g.chiSquareOverRejects) : [];
  if (small.length === 0 && overRejecting.length === 0) return null;
  return (
    <Stack gap="xs">
      {small.length > 0 && (
        <Alert color="orange" variant="light" title={`Small ${small.length === 1 ? 'group' : 'groups'}`}>
          <Text size="sm">
            {small.map((g) => g.group).join(', ')} {small.length === 1 ? 'has' : 'have'} few members for {sizes.p}{' '}
            variables: distances to {small.length === 1 ? 'it' : 'them'} are unsteady, so true members look like
            outsiders more often than α = {sizes.alpha} says.{' '}
            {basis === 'hotelling'
              ? 'The Hotelling basis in use allows for group size in the probabilities; fewer elements or more members would still steady them.'
              : 'Use fewer elements, add members, or judge on the Hotelling basis.'}
          </Text>
          <List size="sm">
            {small.map((g) => (
              <List.Item key={g.group}>
                {g.group}: {g.messages.join('; ')}
              </List.Item>
            ))}
          </List>
        </Alert>
      )}
      {overRejecting.length > 0 && (
        <Alert color="orange" variant="light" title="The χ² basis rejects too many true members here">
          <Text size="sm">
            With {sizes.p} variables the χ² rule would turn away, instead of {100 * sizes.alpha} % of true members:{' '}
            {overRejecting.map((g) => `${g.group} ${percent(g.chiSquareFalseRejectionRate)}`).join(', ')}. The Hotelling
            basis accounts for each group's size exactly.
          </Text>
        </Alert>
      )}
    </Stack>
  );
}
