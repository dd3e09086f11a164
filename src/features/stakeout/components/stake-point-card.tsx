import { useState } from 'react';
import type { StakePointDto } from '@shared/api';
import type { LinearUnit, StationStyle } from '@shared/domain';
import { formatStation } from '@shared/geometry';
import { STAKE_POINT_KIND_LABELS } from '@shared/schemas/stakeout';
import { KindSwatch } from '@/components/kind-swatch';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { TextField } from '@/components/ui/field';
import { Badge } from '@/components/ui/states';
import { formatCoordinate, formatDateTime, formatElevation, formatLength, formatOffset } from '@/lib/format';
import { useMarkStaked } from '../api/mark-staked';
import { useUnmarkStaked } from '../api/unmark-staked';

export interface StakeFrame {
  projectId: number;
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
}

const REF_LABELS: Record<StakePointDto['elevationRef'], string> = {
  line_top: 'top of line',
  ground: 'ground',
  pit_bottom: 'pit bottom',
};

const KIND_TONES: Record<StakePointDto['kind'], string> = {
  crossing: 'bg-ok-100 text-ok-700',
  suggested_hole: 'bg-caution-100 text-caution-800',
  pit_corner: 'bg-ink-100 text-ink-700',
};

/** `2027-03-04T09:15` in the browser's time zone, for a datetime-local input. */
function localNow(): string {
  const d = new Date();
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

function MarkForm({ point, frame, onDone }: { point: StakePointDto; frame: StakeFrame; onDone: () => void }) {
  const mark = useMarkStaked(frame.projectId);
  const [at, setAt] = useState(localNow);
  const [note, setNote] = useState('');
  const fieldError = (path: string) => {
    const e = mark.error as { fieldErrors?: { path: string; message: string }[] } | null;
    const found = e?.fieldErrors?.find((x) => x.path === path);
    return found ? { message: found.message } : undefined;
  };
  return (
    <form
      className="mt-2 space-y-2 rounded-md border border-ink-200 bg-ink-50 p-3"
      aria-label={`Mark ${point.name} staked`}
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        const date = new Date(at);
        mark.mutate({ key: point.key, stakedAt: Number.isNaN(date.getTime()) ? undefined : date.toISOString(), note: note || undefined }, { onSuccess: onDone });
      }}
    >
      {mark.error && <ProblemAlert error={mark.error} fields={['stakedAt', 'note']} />}
      <TextField label="Staked at" type="datetime-local" value={at} onChange={(e) => setAt(e.target.value)} error={fieldError('stakedAt')} />
      <TextField label="Note" placeholder="Hub and lath, paint, offset stake…" value={note} onChange={(e) => setNote(e.target.value)} error={fieldError('note')} />
      <div className="flex gap-2">
        <Button type="submit" size="sm" busy={mark.isPending}>
          Save
        </Button>
        <Button size="sm" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** One point to stake: what it is, where (N/E/Z, station/offset), and whether it has been staked. */
export function StakePointCard({ point, frame, canStake }: { point: StakePointDto; frame: StakeFrame; canStake: boolean }) {
  const [marking, setMarking] = useState(false);
  const unmark = useUnmarkStaked(frame.projectId);
  const moved = point.movedSinceStaked != null && point.movedSinceStaked > (frame.unit === 'm' ? 0.005 : 0.01);
  return (
    <li className={cn('@container rounded-lg border bg-white p-3', point.mark ? (moved ? 'border-caution-300' : 'border-ok-100') : 'border-ink-200')} aria-label={`Point ${point.name}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-semibold text-ink-900">{point.name}</p>
          <p className="text-sm text-ink-700">{point.description}</p>
          {point.lineKind && (
            <p className="text-xs text-ink-600">
              <KindSwatch kind={point.lineKind} />
            </p>
          )}
        </div>
        <Badge className={KIND_TONES[point.kind]}>{STAKE_POINT_KIND_LABELS[point.kind]}</Badge>
      </div>
      <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm @3xl:grid-cols-4">
        <div>
          <dt className="text-xs text-ink-500">Northing</dt>
          <dd className="tabular">{formatCoordinate(point.northing, frame.unit)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-500">Easting</dt>
          <dd className="tabular">{formatCoordinate(point.easting, frame.unit)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-500">Elevation ({REF_LABELS[point.elevationRef]})</dt>
          <dd className="tabular">{formatElevation(point.elevation, frame.unit, frame.datum)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-500">Station, offset</dt>
          <dd className="tabular">
            {formatStation(point.station, frame.stationStyle)}, {formatOffset(point.offset, point.side, frame.unit)}
            {point.beyond && <span className="block text-xs text-caution-800">beyond the bore’s {point.beyond}</span>}
          </dd>
        </div>
      </dl>
      {point.elevationNote && <p className="mt-1 text-xs text-ink-500">{point.elevationNote}</p>}
      <div className="mt-2 flex flex-wrap items-center justify-between gap-2 border-t border-ink-100 pt-2">
        <p className="text-sm">
          {point.mark ? (
            <>
              <span className="font-medium text-ok-700">Staked</span> {formatDateTime(point.mark.stakedAt)}
              {point.mark.stakedByName && <> by {point.mark.stakedByName}</>}
              {point.mark.note && <span className="block text-xs text-ink-600">{point.mark.note}</span>}
              {moved && (
                <span className="block font-medium text-caution-800">
                  Moved {formatLength(point.movedSinceStaked, frame.unit)} since it was staked: stake it again.
                </span>
              )}
            </>
          ) : (
            <span className="text-ink-600">Not staked</span>
          )}
        </p>
        {canStake && !marking && (
          <div className="flex gap-2">
            <Button size="sm" variant={point.mark && !moved ? 'secondary' : 'primary'} onClick={() => setMarking(true)}>
              {point.mark ? 'Stake again' : 'Mark staked'}
            </Button>
            {point.mark && (
              <Button size="sm" variant="ghost" busy={unmark.isPending} onClick={() => unmark.mutate(point.mark!.id)}>
                Remove mark
              </Button>
            )}
          </div>
        )}
      </div>
      {unmark.error && <ProblemAlert error={unmark.error} />}
      {marking && <MarkForm point={point} frame={frame} onDone={() => setMarking(false)} />}
    </li>
  );
}
