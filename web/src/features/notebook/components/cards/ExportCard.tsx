import { Button, Stack, Text } from '@mantine/core';

/**
 * Export: result bundles are built by the bundle job (its own issue). Until its route exists the card
 * says so plainly rather than offering a button that does nothing.
 */
export function ExportCard() {
  return (
    <Stack gap="sm">
      <Text size="sm">
        A result bundle holds the inputs, the groups, every result and an offline report, with checksums anyone can
        verify. Building bundles from the notebook is not available in this version yet.
      </Text>
      <Button disabled w="fit-content">
        Build a result bundle
      </Button>
    </Stack>
  );
}
