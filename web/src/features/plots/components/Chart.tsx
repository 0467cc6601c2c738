import { Button, Group, Loader } from '@mantine/core';
import { lazy, Suspense, useRef } from 'react';

const Plot = lazy(() => import('./PlotlyImpl'));

export interface ChartProps {
  /** Plotly traces and layout, built from results the API returned. */
  data: unknown[];
  layout: Record<string, unknown>;
  /** File name (without extension) for the PNG and SVG downloads. */
  filename: string;
  /** Accessible name of the chart. */
  label: string;
  height?: number;
  onPointClick?: (point: { x: unknown; y: unknown; customdata?: unknown; curveNumber: number }) => void;
}

/** A lazily loaded Plotly chart with PNG and SVG download buttons. */
export function Chart({ data, layout, filename, label, height = 460, onPointClick }: ChartProps) {
  const graph = useRef<HTMLElement | null>(null);
  const download = async (format: 'png' | 'svg') => {
    if (!graph.current) return;
    const { downloadChart } = await import('./PlotlyImpl');
    await downloadChart(graph.current, format, filename);
  };
  return (
    <figure aria-label={label} style={{ margin: 0 }}>
      <Suspense fallback={<Loader size="sm" aria-label="Loading the chart" />}>
        <Plot
          data={data}
          layout={{ autosize: true, height, margin: { l: 60, r: 20, t: 30, b: 50 }, ...layout }}
          config={{ displaylogo: false, responsive: true, modeBarButtonsToRemove: ['toImage'] }}
          style={{ width: '100%' }}
          useResizeHandler
          onInitialized={(_figure, div) => (graph.current = div)}
          onUpdate={(_figure, div) => (graph.current = div)}
          onClick={(event: { points?: { x: unknown; y: unknown; customdata?: unknown; curveNumber: number }[] }) => {
            const point = event.points?.[0];
            if (point && onPointClick) onPointClick(point);
          }}
        />
      </Suspense>
      <Group gap="xs" justify="flex-end">
        <Button size="compact-xs" variant="default" onClick={() => void download('png')}>
          Download PNG
        </Button>
        <Button size="compact-xs" variant="default" onClick={() => void download('svg')}>
          Download SVG
        </Button>
      </Group>
    </figure>
  );
}
