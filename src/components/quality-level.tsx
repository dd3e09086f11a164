import type { QualityLevel } from '@shared/domain';
import { Badge } from './ui/states';

/** What each ASCE/UESI/CI 38-22 quality level means, in short. */
export const QUALITY_LEVEL_MEANINGS: Record<QualityLevel, string> = {
  D: 'QL-D: from records or recollection',
  C: 'QL-C: surveyed surface features correlated with records',
  B: 'QL-B: horizontal position from surface geophysics',
  A: 'QL-A: exposed and measured at a point',
};

const TONES: Record<QualityLevel, string> = {
  A: 'bg-ok-100 text-ok-700',
  B: 'bg-brand-100 text-brand-800',
  C: 'bg-ink-100 text-ink-700',
  D: 'bg-caution-100 text-caution-800',
};

/** A quality-level badge with its meaning as the accessible name. */
export function QualityLevelBadge({ level }: { level: QualityLevel }) {
  return (
    <Badge className={TONES[level]} title={QUALITY_LEVEL_MEANINGS[level]}>
      <span aria-hidden>QL-{level}</span>
      <span className="sr-only">{QUALITY_LEVEL_MEANINGS[level]}</span>
    </Badge>
  );
}
