/**
 * The one chart frame: a responsive SVG with margins, axes and labels (visx), children drawn in
 * the inner area. Every chart that uses it also offers a table of its data beside it.
 */
import { AxisBottom, AxisLeft } from '@visx/axis';
import { Group } from '@visx/group';
import type { ScaleLinear, ScaleTime } from 'd3-scale';
import type { ReactNode } from 'react';

export const CHART_MARGIN = { top: 12, right: 16, bottom: 44, left: 64 };

export function ChartFrame<X extends ScaleLinear<number, number> | ScaleTime<number, number>>({
  width,
  height,
  x,
  y,
  xLabel,
  yLabel,
  title,
  description,
  children,
  xTickFormat,
}: {
  width: number;
  height: number;
  x: X;
  y: ScaleLinear<number, number>;
  xLabel: string;
  yLabel: string;
  title: string;
  description: string;
  children: ReactNode;
  xTickFormat?: (v: number | Date) => string;
}) {
  const innerH = height - CHART_MARGIN.top - CHART_MARGIN.bottom;
  return (
    <svg width="100%" viewBox={`0 0 ${width} ${height}`} role="img" aria-labelledby={`${title}-t ${title}-d`} className="max-w-full">
      <title id={`${title}-t`}>{title}</title>
      <desc id={`${title}-d`}>{description}</desc>
      <Group left={CHART_MARGIN.left} top={CHART_MARGIN.top}>
        {children}
        <AxisLeft scale={y} numTicks={5} label={yLabel} labelOffset={44} stroke="#a6b3c2" tickStroke="#a6b3c2" tickLabelProps={{ fill: '#465669', fontSize: 11, fontFamily: 'Noto Sans Mono, monospace' }} labelProps={{ fill: '#364353', fontSize: 12 }} />
        <AxisBottom
          top={innerH}
          scale={x as never}
          numTicks={6}
          label={xLabel}
          stroke="#a6b3c2"
          tickStroke="#a6b3c2"
          tickFormat={xTickFormat as never}
          tickLabelProps={{ fill: '#465669', fontSize: 11, fontFamily: 'Noto Sans Mono, monospace' }}
          labelProps={{ fill: '#364353', fontSize: 12 }}
        />
      </Group>
    </svg>
  );
}
