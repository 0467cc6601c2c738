import { ScrollArea, Table, Text } from '@mantine/core';
import type { ElementSummary } from '@provenote/shared/schemas';

const fmt = (v: number | null) => (v === null ? '—' : v >= 100 ? v.toFixed(0) : v.toPrecision(3));
const fmtP = (p: number) => (p < 0.001 ? p.toExponential(1) : p.toFixed(3));

// About eight rows show at once; a longer list scrolls under its header instead of lengthening the card.
const SCROLL_HEIGHT = 320;

type Screened = ElementSummary['screening']['elements'][number];

function ScreeningCells({ screened }: { screened: Screened | undefined }) {
  if (!screened) return <Table.Td colSpan={2} />;
  if ('reason' in screened)
    return (
      <Table.Td colSpan={2} ta="right" c="dimmed" fz="xs">
        not computed: {screened.reason}
      </Table.Td>
    );
  return (
    <>
      <Table.Td ta="right">{screened.h.toFixed(2)}</Table.Td>
      <Table.Td ta="right">{fmtP(screened.p)}</Table.Td>
    </>
  );
}

/**
 * A compact table to help choose elements: how complete each one is, where its values lie, and how
 * strongly it differs between the reference groups.
 */
export function ElementSummaryTable({ summary, chosen }: { summary: ElementSummary; chosen: string[] }) {
  const screening = new Map(summary.screening.elements.map((e) => [e.element, e]));
  const groups = summary.screening.groups;
  return (
    <>
      <Text size="xs" c="dimmed">
        Reference data, {summary.samples} samples. Median and quartiles (ppm) of the values measured above the detection
        limit. Elements detected in few samples make poor distances.{' '}
        {groups.length >= 2
          ? `Kruskal–Wallis H and its p-value compare the measured values between the ${groups.length} groups of the data's group column (${groups.join(', ')}): a large H and small p mean the element separates them; it is a screening, not a choice made for you.`
          : 'Kruskal–Wallis screening needs at least two groups in the data’s group column.'}
      </Text>
      <ScrollArea.Autosize mah={SCROLL_HEIGHT} type="auto" offsetScrollbars>
        <Table aria-label="Summary per element" striped stickyHeader>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Element</Table.Th>
              <Table.Th ta="right">With a value</Table.Th>
              <Table.Th ta="right">Detected</Table.Th>
              <Table.Th ta="right">Median</Table.Th>
              <Table.Th ta="right">Quartiles</Table.Th>
              <Table.Th ta="right">H</Table.Th>
              <Table.Th ta="right">p</Table.Th>
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
                <Table.Td ta="right" style={{ whiteSpace: 'nowrap' }}>
                  {fmt(e.q1)} – {fmt(e.q3)}
                </Table.Td>
                <ScreeningCells screened={screening.get(e.element)} />
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </ScrollArea.Autosize>
    </>
  );
}
