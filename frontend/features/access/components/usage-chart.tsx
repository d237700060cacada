import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { FiguresTable } from '../../../components/figures-table';
import { seriesColours } from '../../../lib/chart-format';
import type { UsageRow } from '../api/keys';

/** Requests per day over the last 30 days, stacked by route group. */
export function UsageChart({ rows, from }: { rows: UsageRow[]; from: string }) {
  const groups = [...new Set(rows.map((r) => r.routeGroup))].sort();
  const days: Array<Record<string, number | string>> = [];
  for (
    let d = new Date(`${from}T00:00:00Z`);
    d <= new Date();
    d = new Date(d.getTime() + 86_400_000)
  ) {
    const day = d.toISOString().slice(0, 10);
    const row: Record<string, number | string> = { day: day.slice(5) };
    for (const g of groups)
      row[g] = rows
        .filter((r) => r.day === day && r.routeGroup === g)
        .reduce((s, r) => s + r.count, 0);
    days.push(row);
  }
  const total = rows.reduce((s, r) => s + r.count, 0);
  const byGroup = groups.map((g) => ({
    group: g,
    count: rows.filter((r) => r.routeGroup === g).reduce((s, r) => s + r.count, 0),
  }));
  const busiest = days.reduce<{ day: string; count: number } | null>((best, d) => {
    const count = groups.reduce((s, g) => s + Number(d[g] ?? 0), 0);
    return !best || count > best.count ? { day: String(d.day), count } : best;
  }, null);
  const summary = `${total} requests in all${byGroup.length ? `: ${byGroup.map((g) => `${g.group} ${g.count}`).join(', ')}` : ''}${busiest && busiest.count ? `; busiest day ${busiest.day} with ${busiest.count}` : ''}.`;
  return (
    <figure className="rounded-md border border-patina-100 bg-white p-3">
      <figcaption className="mb-2 text-sm font-semibold">
        Requests with your keys, last 30 days ({total} in all)
      </figcaption>
      {total === 0 ? (
        <p className="text-sm text-ink/70">No request has used your keys yet.</p>
      ) : (
        <>
          <div
            role="img"
            aria-label={`Bar chart of requests per day by route group, last 30 days: ${summary}`}
            className="h-60"
          >
            <ResponsiveContainer width="100%" height="100%">
              <BarChart accessibilityLayer={false} data={days}>
                <CartesianGrid stroke="#d5ebe6" />
                <XAxis dataKey="day" interval={4} />
                <YAxis allowDecimals={false} />
                <Tooltip />
                <Legend />
                {groups.map((g, i) => (
                  <Bar
                    key={g}
                    dataKey={g}
                    stackId="a"
                    fill={seriesColours[i % seriesColours.length]}
                    isAnimationActive={false}
                  />
                ))}
              </BarChart>
            </ResponsiveContainer>
          </div>
          <FiguresTable
            summary="The requests per day, as a table"
            caption="Requests per day by route group, last 30 days"
            corner="Day"
            columns={groups}
            rows={days
              .filter((d) => groups.some((g) => Number(d[g] ?? 0) > 0))
              .map((d) => ({
                key: String(d.day),
                label: d.day,
                cells: groups.map((g) => d[g]),
              }))}
          />
        </>
      )}
    </figure>
  );
}
