import { CLEARANCE_STATUS_LABELS, CONFLICT_STATUS_LABELS, type ClearanceStatus, type ConflictStatus } from '@shared/domain';
import { Badge } from '@/components/ui/states';

export { CLEARANCE_STATUS_LABELS };

const CLEARANCE_TONES: Record<ClearanceStatus, string> = {
  overlap: 'bg-danger-600 text-white',
  conflict: 'bg-danger-100 text-danger-800',
  marginal: 'bg-caution-100 text-caution-800',
  unverified: 'bg-ink-200 text-ink-800',
  clear: 'bg-ok-100 text-ok-700',
};

/** The last clearance check's verdict. */
export function ClearanceStatusBadge({ status }: { status: ClearanceStatus }) {
  return (
    <Badge className={CLEARANCE_TONES[status]} title="Result of the last clearance check">
      {CLEARANCE_STATUS_LABELS[status]}
    </Badge>
  );
}

const STATUS_TONES: Record<ConflictStatus, string> = {
  open: 'bg-danger-50 text-danger-800 ring-1 ring-danger-100',
  in_review: 'bg-caution-100 text-caution-800',
  resolved_redesign: 'bg-ok-100 text-ok-700',
  resolved_relocation: 'bg-ok-100 text-ok-700',
  waived: 'bg-brand-100 text-brand-800',
  void: 'bg-ink-100 text-ink-600',
};

/** Where the conflict stands in the register's workflow. */
export function ConflictStatusBadge({ status }: { status: ConflictStatus }) {
  return (
    <Badge className={STATUS_TONES[status]} title="Register status">
      {CONFLICT_STATUS_LABELS[status]}
    </Badge>
  );
}

/** Calendar dates (due, answer due) are stored as midnight UTC: shown in UTC so the day never shifts. */
const calendar = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeZone: 'UTC' });
export function formatCalendarDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? '—' : calendar.format(d);
}

/** `2027-03-04` for a date input. */
export function toDateInput(iso: string | null | undefined): string {
  return iso ? iso.slice(0, 10) : '';
}

/** True when a calendar date lies before today (UTC). */
export function isPastDate(iso: string | null | undefined): boolean {
  if (!iso) return false;
  return iso.slice(0, 10) < new Date().toISOString().slice(0, 10);
}
