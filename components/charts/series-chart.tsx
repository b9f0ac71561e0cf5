'use client';

import { useId, useState } from 'react';
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

/**
 * One curve as two: solid where the correlation is inside its validity range, dashed (same colour) where it warns.
 * Each part keeps the neighbouring point of the other so the line is continuous at the limit.
 */
export function splitByValidity(label: string, points: { x: number; y: number | null; warned: boolean }[], color: number): ChartSeries[] {
  const next = (k: number, warned: boolean) => points[k - 1]?.warned === warned || points[k + 1]?.warned === warned;
  // A point belongs to a part if it is of that part or borders it (so the two lines meet at the limit).
  const inside = points.map((p, k) => ({ x: p.x, y: !p.warned || next(k, false) ? p.y : null }));
  const outside = points.map((p, k) => ({ x: p.x, y: p.warned || next(k, true) ? p.y : null }));
  const anyOutside = points.some((p) => p.warned && p.y !== null);
  return [
    { label, points: inside, color },
    ...(anyOutside ? [{ label: `${label}, outside its validity range`, points: outside, dashed: true, color }] : []),
  ];
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

/** At most this many rows per series in the data table beside the chart (every n-th point). */
const TABLE_ROWS = 25;

/**
 * Lines over one input, optional scattered points (check cases), vertical limit lines and shaded bands. The x axis
 * keeps to the asked range (`xDomain`; points outside it are left out, not allowed to stretch the axes); log or linear
 * scales are the caller's explicit choice, offered to the reader as switches when `scaleSwitches` is set. A caption
 * says what is drawn and a data table gives the numbers, for those who do not see the chart.
 */
export function SeriesChart({ series, points, limits = [], bands = [], xLabel, yLabel, logX, logY: logYProp, xDomain, height = 320, caption, scaleSwitches = false }: {
  series: ChartSeries[];
  points?: { x: number; y: number; label: string }[];
  limits?: { x: number; label: string }[];
  bands?: { from: number; to: number; label: string; color?: number }[];
  xLabel: string;
  yLabel: string;
  logX: boolean;
  logY?: boolean;
  xDomain?: [number, number];
  height?: number;
  caption?: string;
  scaleSwitches?: boolean;
}) {
  const id = useId();
  const [xLog, setXLog] = useState(logX);
  const [yLogChoice, setYLog] = useState<boolean | undefined>(logYProp);
  const inDomain = (x: number) => !xDomain || (x >= xDomain[0] * (1 - 1e-9) && x <= xDomain[1] * (1 + 1e-9));
  const shownPoints = (points ?? []).filter((p) => inDomain(p.x));
  const ys = series.flatMap((s) => s.points.filter((p) => inDomain(p.x)).map((p) => p.y)).concat(shownPoints.map((p) => p.y)).filter((y): y is number => y !== null && Number.isFinite(y));
  const yMin = Math.min(...ys);
  const yMax = Math.max(...ys);
  const canLogY = yMin > 0;
  const yLog = (yLogChoice ?? false) && canLogY;
  const canLogX = (xDomain ? xDomain[0] : Math.min(...series.flatMap((s) => s.points.map((p) => p.x)))) > 0;
  const xIsLog = xLog && canLogX;
  const xs = xDomain ?? [Math.min(...series.flatMap((s) => s.points.map((p) => p.x))), Math.max(...series.flatMap((s) => s.points.map((p) => p.x)))];
  // A limit's label sits on the side of its line that faces the plot's middle, never over the axis labels.
  const leftHalf = (x: number) => (xIsLog && xs[0] > 0 ? Math.log(x / xs[0]) < Math.log(xs[1] / xs[0]) / 2 : x - xs[0] < (xs[1] - xs[0]) / 2);
  const xTicks = xIsLog ? decades(xs[0], xs[1]) : undefined;
  const yTicks = yLog ? decades(yMin, yMax) : undefined;
  // Room for the legend: about three entries per line.
  const shown = series.filter((x) => !x.hideInLegend).length + (shownPoints.length ? 1 : 0);
  const legendHeight = 10 + 20 * Math.max(1, Math.ceil(shown / 3));
  const hidden = (points?.length ?? 0) - shownPoints.length;
  const tableSeries = series.filter((s) => !s.dashed);

  return (
    <figure className="space-y-2" aria-labelledby={`${id}-cap`}>
      {scaleSwitches && (
        <div className="flex flex-wrap gap-4 text-xs" role="group" aria-label="Axis scales">
          <span>{xLabel} axis: <label className="ml-1"><input type="radio" name={`${id}-x`} checked={!xIsLog} onChange={() => setXLog(false)} /> linear</label> <label className="ml-1"><input type="radio" name={`${id}-x`} checked={xIsLog} disabled={!canLogX} onChange={() => setXLog(true)} /> log</label></span>
          <span>{yLabel} axis: <label className="ml-1"><input type="radio" name={`${id}-y`} checked={!yLog} onChange={() => setYLog(false)} /> linear</label> <label className="ml-1"><input type="radio" name={`${id}-y`} checked={yLog} disabled={!canLogY} onChange={() => setYLog(true)} /> log</label></span>
        </div>
      )}
      <div style={{ width: '100%', height }} aria-hidden="true">
        <ResponsiveContainer>
          <ComposedChart margin={{ top: 10, right: 20, bottom: 24, left: 10 }} accessibilityLayer={false}>
            <CartesianGrid stroke="#e6e0d4" />
            <XAxis type="number" dataKey="x" scale={xIsLog ? 'log' : 'linear'} domain={xDomain ?? ['dataMin', 'dataMax']} ticks={xTicks} allowDataOverflow tickFormatter={(v) => formatNumber(v, 3)}
              label={{ value: xLabel, position: 'insideBottom', offset: -14, fill: '#4a5866', fontSize: 12 }} />
            <YAxis type="number" scale={yLog ? 'log' : 'linear'} domain={yLog ? [yMin, yMax] : ['auto', 'auto']} ticks={yTicks} allowDataOverflow tickFormatter={(v) => formatNumber(v, 3)} width={70}
              label={{ value: yLabel, angle: -90, position: 'insideLeft', fill: '#4a5866', fontSize: 12 }} />
            <Tooltip formatter={(v) => formatNumber(Number(v), 5)} labelFormatter={(v) => `${xLabel} = ${formatNumber(Number(v), 5)}`} />
            <Legend verticalAlign="top" height={legendHeight} wrapperStyle={{ fontSize: 12, lineHeight: '18px' }} />
            {bands.map((b, k) => <ReferenceArea key={`band-${k}`} x1={b.from} x2={b.to} fill={COLORS[(b.color ?? k) % COLORS.length]} fillOpacity={0.08} label={{ value: b.label, position: 'insideTop', fontSize: 10, fill: '#4a5866' }} />)}
            {limits.filter((l) => inDomain(l.x)).map((l, k) => <ReferenceLine key={`lim-${k}`} x={l.x} stroke="#9a5b00" strokeDasharray="5 3" label={{ value: l.label, position: `${k % 2 ? 'insideBottom' : 'insideTop'}${leftHalf(l.x) ? 'Left' : 'Right'}` as 'insideTopLeft', fontSize: 11, fill: '#9a5b00' }} />)}
            {series.map((s, k) => <Line key={s.label} data={s.points.filter((p) => inDomain(p.x))} dataKey="y" name={s.label} stroke={COLORS[(s.color ?? k) % COLORS.length]} strokeDasharray={s.dashed ? '6 4' : undefined} strokeOpacity={s.dashed ? 0.75 : 1} legendType={s.hideInLegend ? 'none' : 'line'} dot={false} strokeWidth={s.dashed ? 1.5 : 2} isAnimationActive={false} connectNulls={false} />)}
            {shownPoints.length > 0 && <Scatter data={shownPoints} dataKey="y" name="check cases" fill="#b0562f" shape="diamond" isAnimationActive={false} />}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption id={`${id}-cap`} className="text-xs text-ink-soft">
        {caption ?? `${yLabel} against ${xLabel}`}{hidden > 0 ? `; ${hidden} point${hidden === 1 ? '' : 's'} outside the plotted range not drawn` : ''}.
      </figcaption>
      <details className="text-xs">
        <summary className="cursor-pointer text-ink-soft">The numbers behind the chart</summary>
        <div className="mt-1 max-h-72 overflow-auto" tabIndex={0} role="region" aria-label={`Values of ${yLabel} against ${xLabel}`}>
          <table className="table-plain">
            <thead><tr><th scope="col">{xLabel}</th>{tableSeries.map((s) => <th key={s.label} scope="col">{s.label}</th>)}</tr></thead>
            <tbody>
              {(tableSeries[0]?.points ?? []).filter((_, k, all) => k % Math.max(1, Math.ceil(all.length / TABLE_ROWS)) === 0 || k === all.length - 1).map((p) => {
                const k = tableSeries[0].points.indexOf(p);
                return (
                  <tr key={k}>
                    <td className="font-mono">{formatNumber(p.x, 5)}</td>
                    {tableSeries.map((s) => {
                      const y = s.points[k]?.y ?? series.find((d) => d.dashed && d.color === s.color)?.points[k]?.y ?? null;
                      const outside = s.points[k]?.y === null && y !== null;
                      return <td key={s.label} className="font-mono">{formatNumber(y, 6)}{outside ? ' (outside range)' : ''}</td>;
                    })}
                  </tr>
                );
              })}
            </tbody>
          </table>
          {shownPoints.length > 0 && <p className="mt-1">Check cases: {shownPoints.map((p) => `${p.label}: ${xLabel} = ${formatNumber(p.x, 5)}, ${formatNumber(p.y, 6)}`).join('; ')}.</p>}
        </div>
      </details>
    </figure>
  );
}
