'use client';

import { CartesianGrid, ComposedChart, Legend, Line, ReferenceArea, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from 'recharts';
import { formatNumber } from '@/lib/client/units';

export interface ChartSeries {
  label: string;
  points: { x: number; y: number | null }[];
  /** Drawn dashed (e.g. outside a validity range). */
  dashed?: boolean;
  /** Index into the palette, to give two series one colour. */
  color?: number;
  /** Left out of the legend (the dashed twin of a solid series). */
  hideInLegend?: boolean;
}

/** Powers of ten covering [lo, hi] (with 2 and 5 in between when the span is short), for log axes. */
function decades(lo: number, hi: number): number[] {
  const out: number[] = [];
  const span = Math.log10(hi / lo);
  const steps = span <= 3 ? [1, 2, 5] : [1];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of steps) {
      const v = m * 10 ** e;
      if (v >= lo * 0.999 && v <= hi * 1.001) out.push(v);
    }
  }
  return out.length >= 2 ? out : [lo, hi];
}

const COLORS = ['#0f5f66', '#b0562f', '#6b4fa0', '#2d6a36', '#9a5b00', '#1d4f91', '#8a2d5c', '#4a5866'];

/**
 * Lines over one input, optional scattered points (check cases), vertical limit lines and shaded
 * validity bands. Log axes when the data span two decades or more.
 */
export function SeriesChart({ series, points, limits = [], bands = [], xLabel, yLabel, logX, height = 320 }: {
  series: ChartSeries[];
  points?: { x: number; y: number; label: string }[];
  limits?: { x: number; label: string }[];
  bands?: { from: number; to: number; label: string; color?: number }[];
  xLabel: string;
  yLabel: string;
  logX: boolean;
  height?: number;
}) {
  const ys = series.flatMap((s) => s.points.map((p) => p.y)).concat((points ?? []).map((p) => p.y)).filter((y): y is number => y !== null && Number.isFinite(y));
  const yMin = Math.min(...ys);
  const yMax = Math.max(...ys);
  const logY = yMin > 0 && yMax / yMin >= 100;
  const xs = series.flatMap((s) => s.points.map((p) => p.x)).concat((points ?? []).map((p) => p.x)).filter((x) => x > 0);
  const xTicks = logX && xs.length ? decades(Math.min(...xs), Math.max(...xs)) : undefined;
  const yTicks = logY ? decades(yMin, yMax) : undefined;
  // Room for the legend: about three entries per line.
  const shown = series.filter((x) => !x.hideInLegend).length + (points?.length ? 1 : 0);
  const legendHeight = 10 + 20 * Math.max(1, Math.ceil(shown / 3));
  return (
    <div style={{ width: '100%', height }}>
      <ResponsiveContainer>
        <ComposedChart margin={{ top: 10, right: 20, bottom: 24, left: 10 }}>
          <CartesianGrid stroke="#e6e0d4" />
          <XAxis type="number" dataKey="x" scale={logX ? 'log' : 'linear'} domain={['dataMin', 'dataMax']} ticks={xTicks} allowDataOverflow tickFormatter={(v) => formatNumber(v, 3)}
            label={{ value: xLabel, position: 'insideBottom', offset: -14, fill: '#4a5866', fontSize: 12 }} />
          <YAxis type="number" scale={logY ? 'log' : 'linear'} domain={['auto', 'auto']} ticks={yTicks} tickFormatter={(v) => formatNumber(v, 3)} width={70}
            label={{ value: yLabel, angle: -90, position: 'insideLeft', fill: '#4a5866', fontSize: 12 }} />
          <Tooltip formatter={(v) => formatNumber(Number(v), 5)} labelFormatter={(v) => `${xLabel} = ${formatNumber(Number(v), 5)}`} />
          <Legend verticalAlign="top" height={legendHeight} wrapperStyle={{ fontSize: 12, lineHeight: '18px' }} />
          {bands.map((b, k) => <ReferenceArea key={`band-${k}`} x1={b.from} x2={b.to} fill={COLORS[(b.color ?? k) % COLORS.length]} fillOpacity={0.08} label={{ value: b.label, position: 'insideTop', fontSize: 10, fill: '#4a5866' }} />)}
          {limits.map((l, k) => <ReferenceLine key={`lim-${k}`} x={l.x} stroke="#9a5b00" strokeDasharray="5 3" label={{ value: l.label, position: 'insideTopRight', fontSize: 11, fill: '#9a5b00' }} />)}
          {series.map((s, k) => <Line key={s.label} data={s.points} dataKey="y" name={s.label} stroke={COLORS[(s.color ?? k) % COLORS.length]} strokeDasharray={s.dashed ? '6 4' : undefined} legendType={s.hideInLegend ? 'none' : 'line'} dot={false} strokeWidth={s.dashed ? 1.5 : 2} isAnimationActive={false} connectNulls={false} />)}
          {points && points.length > 0 && <Scatter data={points} dataKey="y" name="check cases" fill="#b0562f" shape="diamond" isAnimationActive={false} />}
        </ComposedChart>
      </ResponsiveContainer>
    </div>
  );
}
