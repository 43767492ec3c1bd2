"use client";

import { Bar, BarChart, CartesianGrid, LabelList, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { tableClassName } from "@/components/table";

export interface BarSeries {
  key: string;
  label: string;
  colour: string;
  /** After a value in the tooltip and the table (" h"); the props cross from server pages, so words, not a function. */
  unit?: string;
}

export interface BarRow {
  label: string;
  values: Record<string, number>;
  /** Words after the row's bars, such as "3/12". */
  note?: string;
}

/**
 * Horizontal bars, one row per thing (a subject, a section, a student), the series stacked or side
 * by side. The chart is a picture for those who would rather look; the same figures are always in
 * the table under it, which screen readers read (the chart is labelled by its summary) and which
 * prints and copies.
 */
export function BarFigure({
  title,
  rowHeader,
  summary,
  rows,
  series,
  stacked = false,
  max,
}: {
  title: string;
  /** What each row is ("Subject", "Student"): the table's first column. */
  rowHeader: string;
  summary: string;
  rows: readonly BarRow[];
  series: readonly BarSeries[];
  stacked?: boolean;
  /** The axis's end (a share's 1, the planned hours); the data's own largest value otherwise. */
  max?: number;
}) {
  const data = rows.map((r) => ({ label: r.label, note: r.note ?? "", ...r.values }));
  const rowHeight = stacked || series.length === 1 ? 44 : 30 * series.length + 14;
  const height = rows.length * rowHeight + 70;
  const textOf = (key: string, value: number) => `${value}${series.find((s) => s.key === key)?.unit ?? ""}`;
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="font-semibold">{title}</figcaption>
      <div role="img" aria-label={summary} style={{ height }} className="w-full max-w-4xl">
        <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 720, height }}>
          <BarChart data={data} layout="vertical" margin={{ top: 4, right: 64, bottom: 4, left: 4 }} barCategoryGap={8}>
            <CartesianGrid horizontal={false} stroke="#c9ccd1" />
            <XAxis type="number" domain={[0, max ?? "auto"]} allowDecimals={false} tick={{ fill: "#0d1726", fontSize: 14 }} />
            <YAxis
              type="category"
              dataKey="label"
              width={250}
              tick={{ fill: "#0d1726", fontSize: 15 }}
              tickFormatter={(v: string) => (v.length > 32 ? `${v.slice(0, 31)}…` : v)}
            />
            <Tooltip
              formatter={(value, name) => {
                const s = series.find((x) => x.label === name);
                return [s ? textOf(s.key, Number(value)) : String(value), String(name)];
              }}
              contentStyle={{ fontSize: 15, border: "2px solid #3a4657" }}
            />
            {/* Legend words in ink: a pale series' own colour would be unreadable as text. */}
            <Legend wrapperStyle={{ fontSize: 15 }} formatter={(value: string) => <span style={{ color: "#0d1726" }}>{value}</span>} />
            {series.map((s, i) => (
              <Bar
                key={s.key}
                dataKey={s.key}
                name={s.label}
                fill={s.colour}
                stroke="#0d1726"
                strokeWidth={1}
                stackId={stacked ? "one" : undefined}
                isAnimationActive={false}
              >
                {i === series.length - 1 && rows.some((r) => r.note) ? (
                  <LabelList dataKey="note" position="right" fill="#0d1726" fontSize={15} fontWeight={700} />
                ) : null}
              </Bar>
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <details>
        <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold">The figures as a table</summary>
        <table className={tableClassName}>
          <thead>
            <tr>
              <th scope="col">{rowHeader}</th>
              {series.map((s) => (
                <th key={s.key} scope="col">
                  {s.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.label}>
                <th scope="row">{r.label}</th>
                {series.map((s) => (
                  <td key={s.key}>{textOf(s.key, r.values[s.key] ?? 0)}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
