import { Button, Group, Modal, Stack, Textarea, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { createStudySchema, type Study } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useCreateStudy } from '../api/studies';

interface Props {
  labId: string;
  opened: boolean;
  onClose: () => void;
  onCreated: (study: Study) => void;
}

export function CreateStudyModal({ labId, opened, onClose, onCreated }: Props) {
  const create = useCreateStudy(labId);
  const form = useForm({
    initialValues: { name: '', description: '' },
    validate: (values) => {
      const parsed = createStudySchema.safeParse(values);
      return parsed.success ? {} : Object.fromEntries(parsed.error.issues.map((i) => [i.path.join('.'), i.message]));
    },
  });
  return (
    <Modal opened={opened} onClose={onClose} title="New study">
      <form
        onSubmit={form.onSubmit((values) =>
          create.mutate(values, {
            onSuccess: (study) => {
              form.reset();
              onCreated(study);
            },
            onError: (error) => form.setFieldError('name', errorMessage(error)),
          }),
        )}
      >
        <Stack>
          <TextInput
            label="Name"
            description="What the study asks, e.g. “Sources of the reservoir core sediments”"
            data-autofocus
            {...form.getInputProps('name')}
          />
          <Textarea label="Description" rows={3} {...form.getInputProps('description')} />
          <Group justify="flex-end">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" loading={create.isPending}>
              Create study
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
