import { Group, Text } from '@mantine/core';

export function Logo({ size = 28 }: { size?: number }) {
  return (
    <Group gap={8} wrap="nowrap">
      <img src="/favicon.svg" width={size} height={size} alt="" aria-hidden />
      <Text fw={800} fz="lg" c="tarn.9">
        Provenote
      </Text>
    </Group>
  );
}
