import { LINE_KIND_COLOURS, LINE_KIND_LABELS, type LineKind } from '@shared/domain';

/** The APWA marking colour of a line kind as a small swatch, with the kind's name beside it. */
export function KindSwatch({ kind, showLabel = true }: { kind: LineKind; showLabel?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2">
      <span
        aria-hidden
        className="inline-block size-3.5 shrink-0 rounded-sm ring-1 ring-ink-400/60"
        style={{ backgroundColor: LINE_KIND_COLOURS[kind] }}
      />
      {showLabel ? <span>{LINE_KIND_LABELS[kind]}</span> : <span className="sr-only">{LINE_KIND_LABELS[kind]}</span>}
    </span>
  );
}
