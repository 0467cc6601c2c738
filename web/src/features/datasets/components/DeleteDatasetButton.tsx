import { Alert, Button, Group, Modal, Stack, Text } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { errorMessage } from '../../../app/api-client';

interface Props {
  name: string;
  versionCount: number;
  pending: boolean;
  error: Error | null;
  onConfirm: () => void;
}

/** Deleting drops every version and its rows, so the button asks first and says what will go. */
export function DeleteDatasetButton({ name, versionCount, pending, error, onConfirm }: Props) {
  const [opened, { open, close }] = useDisclosure(false);
  return (
    <>
      <Button color="red" variant="subtle" onClick={open}>
        Delete dataset
      </Button>
      <Modal opened={opened} onClose={close} title={`Delete “${name}”?`}>
        <Stack>
          <Text>
            This deletes all {versionCount} {versionCount === 1 ? 'version' : 'versions'} of the dataset and their
            samples. It cannot be undone; the audit log keeps a note that it was deleted.
          </Text>
          {error && (
            <Alert color="red" title="Not deleted">
              {errorMessage(error)}
            </Alert>
          )}
          <Group justify="flex-end">
            <Button variant="default" onClick={close}>
              Keep it
            </Button>
            <Button color="red" loading={pending} onClick={onConfirm}>
              Delete for good
            </Button>
          </Group>
        </Stack>
      </Modal>
    </>
  );
}
