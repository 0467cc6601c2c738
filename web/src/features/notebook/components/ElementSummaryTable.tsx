import { Table, Text } from '@mantine/core';
import type { ElementSummary } from '@provenote/shared/schemas';

const fmt = (v: number | null) => (v === null ? '—' : v >= 100 ? v.toFixed(0) : v.toPrecision(3));

/** A compact table to help choose elements: how complete each one is and where its values lie. */
export function ElementSummaryTable({ summary, chosen }: { summary: ElementSummary; chosen: string[] }) {
  return (
    <>
      <Text size="xs" c="dimmed">
        Reference data, {summary.samples} samples. Median and quartiles (ppm) of the values measured above the detection
        limit. Elements detected in few samples make poor distances.
      </Text>
      <Table aria-label="Summary per element" striped>
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Element</Table.Th>
            <Table.Th ta="right">With a value</Table.Th>
            <Table.Th ta="right">Detected</Table.Th>
            <Table.Th ta="right">Median</Table.Th>
            <Table.Th ta="right">Quartiles</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {summary.elements.map((e) => (
            <Table.Tr key={e.element} fw={chosen.includes(e.element) ? 600 : undefined}>
              <Table.Td>{e.element}</Table.Td>
              <Table.Td ta="right">{e.withValue}</Table.Td>
              <Table.Td ta="right" c={e.fractionDetected < 0.8 ? 'orange.8' : undefined}>
                {Math.round(100 * e.fractionDetected)} %
              </Table.Td>
              <Table.Td ta="right">{fmt(e.median)}</Table.Td>
              <Table.Td ta="right">
                {fmt(e.q1)} – {fmt(e.q3)}
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </>
  );
}
