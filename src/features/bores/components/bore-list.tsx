import type { ReactNode } from 'react';
import { BORE_METHOD_LABELS, type LinearUnit, type StationStyle } from '@shared/domain';
import type { BoreDto, PitDto } from '@shared/api';
import type { ProfilePoint } from '@shared/schemas/common';
import { UNIT_SYMBOLS } from '@shared/units';
import { Badge } from '@/components/ui/states';
import { formatElevation, formatLength, formatNumber, formatSize, formatStation, polylineLength } from '@/lib/format';

export interface BoreListContext {
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-ink-500">{label}</dt>
      <dd className="text-sm font-medium text-ink-900 tabular">{children}</dd>
    </div>
  );
}

/** Station–elevation points with the straight grade to the next point. */
function ProfileTable({ title, points, ctx }: { title: string; points: ProfilePoint[]; ctx: BoreListContext }) {
  if (points.length === 0) return <p className="text-sm text-ink-500">{title}: none entered.</p>;
  const u = UNIT_SYMBOLS[ctx.unit];
  return (
    <div className="relative overflow-x-auto">
      <table className="min-w-full text-sm">
        <caption className="pb-1 text-left text-sm font-semibold text-ink-800">{title}</caption>
        <thead className="text-left text-xs text-ink-500">
          <tr>
            <th scope="col" className="py-1 pr-4 font-medium">
              Station
            </th>
            <th scope="col" className="py-1 pr-4 text-right font-medium">
              Elevation ({u}, {ctx.datum})
            </th>
            <th scope="col" className="py-1 text-right font-medium">
              Grade to next
            </th>
          </tr>
        </thead>
        <tbody>
          {points.map((point, i) => {
            const next = points[i + 1];
            const grade = next ? ((next.elevation - point.elevation) / (next.station - point.station)) * 100 : null;
            return (
              <tr key={`${point.station}-${i}`} className="border-t border-ink-100">
                <th scope="row" className="py-1 pr-4 text-left font-normal whitespace-nowrap tabular">
                  {formatStation(point.station, ctx.stationStyle)}
                </th>
                <td className="py-1 pr-4 text-right whitespace-nowrap tabular">{formatLength(point.elevation, ctx.unit)}</td>
                <td className="py-1 text-right whitespace-nowrap tabular">{grade == null || !Number.isFinite(grade) ? '—' : `${grade >= 0 ? '+' : ''}${formatNumber(grade, 2)} %`}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

export const PIT_LABELS = { launch: 'Launch pit', receiving: 'Receiving pit' } as const;

/**
 * Each bore as a card: method, length, stations, casing, tolerances, profiles and pits. With
 * `renderTools` (people who may edit bores), the card ends with those tools, which list the pits
 * themselves.
 */
export function BoreList({ bores, pits, ctx, renderTools }: { bores: BoreDto[]; pits: PitDto[]; ctx: BoreListContext; renderTools?: (bore: BoreDto, pits: PitDto[]) => ReactNode }) {
  return (
    <ul className="space-y-4">
      {bores.map((bore) => {
        const length = polylineLength(bore.alignment);
        const borePits = pits.filter((p) => p.boreId === bore.id);
        return (
          <li key={bore.id} className="rounded-lg border border-ink-200 bg-white" data-testid="bore-card" data-bore-name={bore.name}>
            <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink-200 px-4 py-3">
              <h2 className="text-base font-semibold text-ink-900">{bore.name}</h2>
              <Badge className="bg-brand-100 text-brand-800">{BORE_METHOD_LABELS[bore.method]}</Badge>
            </div>
            <div className="space-y-4 p-4">
              <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6">
                <Fact label="Plan length">{formatLength(length, ctx.unit)}</Fact>
                <Fact label="Begin station">{formatStation(bore.beginStation, ctx.stationStyle)}</Fact>
                <Fact label="End station">{formatStation(bore.beginStation + length, ctx.stationStyle)}</Fact>
                <Fact label="Casing outside diameter">{formatSize(bore.casingOd, ctx.unit)}</Fact>
                <Fact label="Carrier pipe">{formatSize(bore.carrierSize, ctx.unit)}</Fact>
                <Fact label="Minimum cover">{formatLength(bore.minCover, ctx.unit)}</Fact>
                <Fact label="Tolerance, line">± {formatLength(bore.toleranceHorizontal, ctx.unit)}</Fact>
                <Fact label="Tolerance, grade">± {formatLength(bore.toleranceVertical, ctx.unit)}</Fact>
                <Fact label="Alignment vertices">{bore.alignment.length}</Fact>
              </dl>
              <div className="grid gap-4 lg:grid-cols-2">
                <ProfileTable title="Casing centreline profile" points={bore.profile} ctx={ctx} />
                <ProfileTable title="Ground profile" points={bore.groundProfile} ctx={ctx} />
              </div>
              {!renderTools && borePits.length > 0 && (
                <div>
                  <h3 className="text-sm font-semibold text-ink-800">Pits</h3>
                  <ul className="mt-1 space-y-1 text-sm">
                    {borePits.map((pit) => (
                      <li key={pit.id}>
                        {PIT_LABELS[pit.kind]}: bottom {formatElevation(pit.bottomElevation, ctx.unit, ctx.datum)}, {pit.footprint.length}-corner footprint
                      </li>
                    ))}
                  </ul>
                </div>
              )}
              {bore.notes && <p className="text-sm whitespace-pre-line text-ink-700">{bore.notes}</p>}
              {renderTools?.(bore, borePits)}
            </div>
          </li>
        );
      })}
    </ul>
  );
}
