/**
 * The profile strip: the bore in section along its stations, drawn by us in SVG with d3-scale.
 * Ground, minimum cover, the casing band, the tolerance envelope, the bore window, each crossed
 * line to scale at its elevation with its clearance dimension, test holes as ticks on the
 * ground, pits. In editing mode the profile points can be dragged (or moved with the arrow
 * keys) and every figure follows.
 */
import { scaleLinear } from 'd3-scale';
import { useLayoutEffect, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent } from 'react';
import { LINE_KIND_COLOURS, LINE_KIND_LABELS, type StationStyle, type LinearUnit } from '@shared/domain';
import type { BoreDto, HoleDto, LineDto, PitDto } from '@shared/api';
import { formatStation, stationOffset, type BoreReport, type ClearancePoint, type LineClearance } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { formatNumber } from '@/lib/format';
import { round } from '../lib/live';
import { sameItem, useSelection, useSelectionStore, type PlanItem } from '../lib/selection';
import { STATUS_COLOURS, STATUS_LABELS } from '../lib/styles';

export type Exaggeration = 'auto' | 1 | 2 | 5 | 10 | 20 | 50;
export const EXAGGERATIONS: Exaggeration[] = ['auto', 1, 2, 5, 10, 20, 50];

export interface ProfileStripProps {
  /** The bore as drawn (the draft while editing). */
  bore: BoreDto;
  /** The bore as saved: it fixes the scales, so they hold still while a point is dragged. */
  baseBore: BoreDto;
  report: BoreReport | null;
  lines: ReadonlyMap<number, LineDto>;
  holes: readonly HoleDto[];
  pits: readonly PitDto[];
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  exaggeration: Exaggeration;
  editing: boolean;
  onMovePoint?: (index: number, station: number, elevation: number) => void;
  /** Fixed size (print); otherwise the strip follows its container's width. */
  width?: number;
  height?: number;
  id?: string;
}

const M = { left: 62, right: 14, top: 26, bottom: 40 };
const NICE_VE = [1, 2, 5, 10, 20, 50, 100];
const ROW_HEIGHT = 26;

function shortName(name: string): string {
  return name.length > 30 ? `${name.slice(0, 28)}…` : name;
}

function profileAt(points: readonly { station: number; elevation: number }[], s: number): number | null {
  if (points.length === 0) return null;
  if (s < points[0]!.station - 1e-9 || s > points[points.length - 1]!.station + 1e-9) return null;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    if (s <= b.station + 1e-9) return a.elevation + ((s - a.station) / (b.station - a.station || 1)) * (b.elevation - a.elevation);
  }
  return points[points.length - 1]!.elevation;
}

function boreLength(b: BoreDto): number {
  let t = 0;
  for (let i = 1; i < b.alignment.length; i++) t += Math.hypot(b.alignment[i]![0] - b.alignment[i - 1]![0], b.alignment[i]![1] - b.alignment[i - 1]![1]);
  return t;
}

/** Line size across (width) and up (height). */
function lineSize(line: LineDto | undefined): { w: number; h: number; box: boolean } {
  if (!line) return { w: 0.5, h: 0.5, box: false };
  if (line.shape === 'box') return { w: line.width ?? 1, h: line.height ?? 1, box: true };
  const d = line.diameter ?? 0.5;
  return { w: d, h: d, box: false };
}

function useWidth(ref: React.RefObject<HTMLDivElement | null>, fixed?: number): number {
  const [width, setWidth] = useState(fixed ?? 320);
  useLayoutEffect(() => {
    if (fixed) return;
    const el = ref.current;
    if (!el) return;
    const first = Math.round(el.getBoundingClientRect().width);
    if (first > 0) setWidth(first);
    const ro = new ResizeObserver((entries) => {
      const w = Math.round(entries[0]?.contentRect.width ?? 800);
      if (w > 0) setWidth(w);
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, [ref, fixed]);
  return fixed ?? width;
}

export function ProfileStrip(props: ProfileStripProps) {
  const { bore, baseBore, report, lines, holes, pits, unit, datum, stationStyle, exaggeration, editing, onMovePoint } = props;
  const box = useRef<HTMLDivElement>(null);
  const width = Math.max(300, useWidth(box, props.width));
  const narrow = width < 640;
  /** Top of the callout rows: below the header line (two header lines on a phone). */
  const T = narrow ? 34 : M.top;
  const store = useSelectionStore();
  const selection = useSelection();
  const u = UNIT_SYMBOLS[unit];
  const digits = unit === 'm' ? 2 : 2;

  const radius = bore.casingOd / 2;
  const length = boreLength(baseBore);
  const begin = baseBore.beginStation;
  const end = begin + length;

  // Scales from the saved bore and the lines: they do not move while a point is dragged.
  const layout = useMemo(() => {
    const pad = Math.max(length * 0.03, 1);
    const x = scaleLinear().domain([begin - pad, end + pad]).range([M.left, width - M.right]);
    // Callouts: each line's name and figure sit in rows above the ground, packed so none overlap,
    // with a leader down to the line. Widths are estimated from the name (figures vary while editing).
    const callouts = new Map<number, { centre: number; row: number }>();
    const rows: number[] = [];
    const items = (report?.lines ?? [])
      .map((lc) => ({ lc, p: lc.points[lc.governingPoint] }))
      .filter((i) => i.p && i.p.lineTop != null && i.p.lineBottom != null)
      .map(({ lc, p }) => {
        const name = shortName(lines.get(lc.lineId)?.label ?? lc.label);
        const w = Math.max(name.length, 27) * 5.6 + 8;
        return { id: lc.lineId, cx: x(p!.station), w };
      })
      .sort((a, b) => a.cx - b.cx);
    for (const it of items) {
      const centre = Math.min(Math.max(it.cx, M.left + it.w / 2), width - M.right - it.w / 2);
      let row = rows.findIndex((right) => right + 6 < centre - it.w / 2);
      if (row === -1) {
        row = rows.length;
        rows.push(0);
      }
      rows[row] = centre + it.w / 2;
      callouts.set(it.id, { centre, row });
    }
    const band = rows.length ? rows.length * ROW_HEIGHT + 6 : 0;
    return { x, callouts, band, pad };
  }, [report, lines, width, length, begin, end]);
  // The strip grows with the callout rows, so the drawing keeps its height.
  const height = props.height ?? (narrow ? 300 : 330) + layout.band;

  const scales = useMemo(() => {
    const { x, callouts, band, pad } = layout;
    const ys: number[] = [];
    for (const p of baseBore.groundProfile) ys.push(p.elevation);
    for (const p of baseBore.profile) ys.push(p.elevation - baseBore.casingOd / 2 - baseBore.toleranceVertical, p.elevation + baseBore.casingOd / 2 + baseBore.toleranceVertical);
    for (const lc of report?.lines ?? []) {
      const p = lc.points[lc.governingPoint];
      if (p?.lineTop != null) ys.push(p.lineTop);
      if (p?.lineBottom != null) ys.push(p.lineBottom);
    }
    for (const pit of pits) ys.push(pit.bottomElevation);
    let y0 = Math.min(...ys);
    let y1 = Math.max(...ys);
    if (!Number.isFinite(y0) || !Number.isFinite(y1)) {
      y0 = 0;
      y1 = 10;
    }
    const ySpan = Math.max(y1 - y0, baseBore.casingOd * 4, 1);
    const mid = (y0 + y1) / 2;
    const top = T + band;
    const plotH = height - top - M.bottom;
    const kx = (width - M.left - M.right) / (end - begin + 2 * pad);
    // room for dragging: the data fill about 85 % of the height
    const fitVe = plotH / (ySpan * 1.18) / kx;
    const ve = exaggeration === 'auto' ? ([...NICE_VE].reverse().find((v) => v <= fitVe) ?? Math.max(0.1, round(fitVe, 2))) : exaggeration;
    const half = plotH / (kx * ve) / 2;
    const y = scaleLinear().domain([mid - half, mid + half]).range([height - M.bottom, top]);
    return { x, y, ve, kx, ky: kx * ve, callouts, top };
  }, [layout, baseBore, report, pits, width, height, exaggeration, begin, end, T]);
  const { x, y } = scales;

  const path = (pts: readonly { station: number; elevation: number }[]) => pts.map((p, i) => `${i ? 'L' : 'M'}${x(p.station).toFixed(1)},${y(p.elevation).toFixed(1)}`).join('');

  // Stations where the profiles break, for the bands and the cover line.
  const breaks = useMemo(() => {
    const set = new Set<number>();
    for (const p of bore.profile) set.add(p.station);
    for (const p of bore.groundProfile) set.add(p.station);
    set.add(begin);
    set.add(end);
    return [...set].filter((s) => s >= begin - 1e-9 && s <= end + 1e-9).sort((a, b) => a - b);
  }, [bore.profile, bore.groundProfile, begin, end]);

  const band = (offsetTop: number, offsetBottom: number, shift = 0) => {
    const top: string[] = [];
    const bottom: string[] = [];
    for (const s of breaks) {
      const c = profileAt(bore.profile, s);
      if (c === null) continue;
      top.push(`${x(s).toFixed(1)},${y(c + shift + offsetTop).toFixed(1)}`);
      bottom.unshift(`${x(s).toFixed(1)},${y(c + shift + offsetBottom).toFixed(1)}`);
    }
    return top.length ? `M${top.join('L')}L${bottom.join('L')}Z` : '';
  };

  const groundPath = path(bore.groundProfile);
  const groundFill = bore.groundProfile.length
    ? `${groundPath}L${x(bore.groundProfile[bore.groundProfile.length - 1]!.station).toFixed(1)},${height - M.bottom}L${x(bore.groundProfile[0]!.station).toFixed(1)},${height - M.bottom}Z`
    : '';
  const coverLine = bore.groundProfile.length ? path(bore.groundProfile.map((p) => ({ station: p.station, elevation: p.elevation - bore.minCover }))) : '';

  const shiftWindow = report?.window?.withAllowance.shift ?? null;
  const windowPath = (() => {
    if (!shiftWindow || shiftWindow.empty) return '';
    const [lo, hi] = y.domain() as [number, number];
    const top: string[] = [];
    const bottom: string[] = [];
    for (const s of breaks) {
      const c = profileAt(bore.profile, s);
      if (c === null) continue;
      const up = shiftWindow.up === null ? hi : c + shiftWindow.up + radius;
      const down = shiftWindow.down === null ? lo : c + shiftWindow.down - radius;
      top.push(`${x(s).toFixed(1)},${y(Math.min(up, hi)).toFixed(1)}`);
      bottom.unshift(`${x(s).toFixed(1)},${y(Math.max(down, lo)).toFixed(1)}`);
    }
    return top.length ? `M${top.join('L')}L${bottom.join('L')}Z` : '';
  })();

  // Holes of the lines in the report, as ticks on the ground at their bore station.
  const holeTicks = useMemo(() => {
    const near = new Set(report?.lines.map((l) => l.lineId) ?? []);
    const out: { hole: HoleDto; station: number; ground: number }[] = [];
    for (const h of holes) {
      if (!near.has(h.lineId)) continue;
      try {
        const so = stationOffset(bore.alignment, bore.beginStation, [h.surveyedEasting ?? h.easting, h.surveyedNorthing ?? h.northing]);
        if (so.beyond) continue;
        const g = profileAt(bore.groundProfile, so.station) ?? h.groundElevation;
        if (g == null) continue;
        out.push({ hole: h, station: so.station, ground: g });
      } catch {
        // a hole the alignment cannot place is simply not drawn
      }
    }
    // label a tick only when it has room; the tick itself is always drawn
    out.sort((a, b) => a.station - b.station);
    return out;
  }, [holes, report, bore.alignment, bore.beginStation, bore.groundProfile]);
  const labelledHoles = useMemo(() => {
    const keep = new Set<number>();
    let last = -Infinity;
    for (const t of holeTicks) {
      const px = x(t.station);
      if (px - last >= 30) {
        keep.add(t.hole.id);
        last = px;
      }
    }
    return keep;
  }, [holeTicks, x]);

  const pitBoxes = pits.map((pit) => {
    const stations = pit.footprint.map((p) => stationOffset(bore.alignment, bore.beginStation, p).station);
    const s0 = Math.min(...stations);
    const s1 = Math.max(...stations);
    const g = profileAt(bore.groundProfile, Math.min(Math.max((s0 + s1) / 2, begin), end)) ?? pit.bottomElevation + 3;
    return { pit, s0, s1, top: g };
  });

  const xTicks = x.ticks(Math.max(3, Math.floor(width / 110)));
  const yTicks = y.ticks(6);
  const yStep = yTicks.length > 1 ? yTicks[1]! - yTicks[0]! : 1;
  const yDecimals = yStep >= 1 ? 0 : yStep >= 0.1 ? 1 : 2;

  // Dragging profile points.
  const svgRef = useRef<SVGSVGElement>(null);
  const drag = useRef<number | null>(null);
  const raf = useRef(0);
  const move = (index: number, clientX: number, clientY: number) => {
    const svg = svgRef.current;
    if (!svg || !onMovePoint) return;
    const r = svg.getBoundingClientRect();
    const px = ((clientX - r.left) / r.width) * width;
    const py = ((clientY - r.top) / r.height) * height;
    const pts = bore.profile;
    let station = pts[index]!.station;
    if (index > 0 && index < pts.length - 1) {
      const lo = pts[index - 1]!.station + 0.5;
      const hi = pts[index + 1]!.station - 0.5;
      station = round(Math.min(hi, Math.max(lo, x.invert(px))), 2);
    }
    const elevation = round(y.invert(py), 2);
    cancelAnimationFrame(raf.current);
    raf.current = requestAnimationFrame(() => onMovePoint(index, station, elevation));
  };
  const onPointerDown = (index: number) => (e: ReactPointerEvent<SVGCircleElement>) => {
    if (!editing) return;
    e.preventDefault();
    (e.target as Element).setPointerCapture(e.pointerId);
    drag.current = index;
  };
  const onPointerMove = (e: ReactPointerEvent<SVGCircleElement>) => {
    if (drag.current === null) return;
    move(drag.current, e.clientX, e.clientY);
  };
  const onPointerUp = (e: ReactPointerEvent<SVGCircleElement>) => {
    drag.current = null;
    (e.target as Element).releasePointerCapture?.(e.pointerId);
  };

  const select = (item: PlanItem) => store.select(sameItem(store.get().selected, item) ? null : item);

  const drawLine = (lc: LineClearance) => {
    const p: ClearancePoint | undefined = lc.points[lc.governingPoint];
    const line = lines.get(lc.lineId);
    if (!p || p.lineTop == null || p.lineBottom == null) return null;
    const item: PlanItem = { type: 'line', id: lc.lineId };
    const selected = sameItem(selection.selected, item);
    const hovered = sameItem(selection.hovered, item);
    const size = lineSize(line);
    const crossing = lc.relation === 'crossing' && p.kind === 'crossing';
    const angle = crossing && p.crossingAngle ? Math.max(10, p.crossingAngle) : 90;
    const along = size.w / 2 / Math.sin((angle * Math.PI) / 180);
    const cx = x(p.station);
    const cyElev = (p.lineTop + p.lineBottom) / 2;
    const rx = Math.max(2, along * scales.kx);
    const ry = Math.max(2, ((p.lineTop - p.lineBottom) / 2) * scales.ky);
    const colour = STATUS_COLOURS[lc.status];
    const casingTop = p.boreCentreline != null ? p.boreCentreline + radius : null;
    const casingBottom = p.boreCentreline != null ? p.boreCentreline - radius : null;
    const dimFrom = p.position === 'above' ? p.lineBottom : p.lineTop;
    const dimTo = p.position === 'above' ? casingTop : casingBottom;
    const callout = scales.callouts.get(lc.lineId);
    const name = line?.label ?? lc.label;
    const short = shortName(name);
    const figure = lc.clearance != null ? `${formatNumber(lc.clearance, digits)} ${u}` : 'no figure';
    return (
      <g
        key={lc.lineId}
        data-line-id={lc.lineId}
        data-status={lc.status}
        data-selected={selected ? 'true' : 'false'}
        role="button"
        tabIndex={0}
        aria-pressed={selected}
        aria-label={`${name}: ${STATUS_LABELS[lc.status]}, ${lc.relation === 'crossing' ? 'crosses' : 'beside'} at ${formatStation(p.station, stationStyle)}, clearance ${figure}, required ${formatNumber(lc.required, digits)} ${u}`}
        className="cursor-pointer outline-none focus-visible:[&>.tl-shape]:stroke-[#0ea5e9]"
        onClick={(e) => {
          e.stopPropagation();
          select(item);
        }}
        onKeyDown={(e) => {
          if (e.key === 'Enter' || e.key === ' ') {
            e.preventDefault();
            select(item);
          }
        }}
        onMouseEnter={() => store.hover(item)}
        onMouseLeave={() => sameItem(store.get().hovered, item) && store.hover(null)}
      >
        <title>{`${name} (${line ? LINE_KIND_LABELS[line.kind] : lc.kind}): ${STATUS_LABELS[lc.status]}, clearance ${figure} against ${formatNumber(lc.required, digits)} ${u} required`}</title>
        {(selected || hovered) && (
          size.box ? (
            <rect x={cx - rx - 5} y={y(p.lineTop) - 5} width={2 * rx + 10} height={2 * ry + 10} fill="none" stroke="#0ea5e9" strokeWidth={selected ? 4 : 2} />
          ) : (
            <ellipse cx={cx} cy={y(cyElev)} rx={rx + 5} ry={ry + 5} fill="none" stroke="#0ea5e9" strokeWidth={selected ? 4 : 2} />
          )
        )}
        {size.box ? (
          <rect className="tl-shape" x={cx - rx} y={y(p.lineTop)} width={2 * rx} height={2 * ry} fill={colour} fillOpacity={0.35} stroke={colour} strokeWidth={2} strokeDasharray={crossing ? undefined : '4 3'} />
        ) : (
          <ellipse className="tl-shape" cx={cx} cy={y(cyElev)} rx={rx} ry={ry} fill={colour} fillOpacity={0.35} stroke={colour} strokeWidth={2} strokeDasharray={crossing ? undefined : '4 3'} />
        )}
        {/* APWA colour of the kind: a small square in the middle */}
        <rect x={cx - 3} y={y(cyElev) - 3} width={6} height={6} fill={line ? LINE_KIND_COLOURS[line.kind] : '#6b7280'} stroke="#1e2226" strokeWidth={0.5} />
        {dimTo != null && crossing && (
          <g stroke={colour} strokeWidth={1.4}>
            <line x1={cx + rx + 6} x2={cx + rx + 6} y1={y(dimFrom)} y2={y(dimTo)} />
            <line x1={cx + rx + 2} x2={cx + rx + 10} y1={y(dimFrom)} y2={y(dimFrom)} />
            <line x1={cx + rx + 2} x2={cx + rx + 10} y1={y(dimTo)} y2={y(dimTo)} />
          </g>
        )}
        {callout && (
          <>
            <polyline
              points={`${callout.centre},${T + callout.row * ROW_HEIGHT + 24} ${callout.centre},${T + callout.row * ROW_HEIGHT + 27} ${cx},${Math.max(T + callout.row * ROW_HEIGHT + 30, y(p.lineTop) - 3)} ${cx},${y(p.lineTop) - 2}`}
              fill="none"
              stroke={colour}
              strokeOpacity={selected || hovered ? 1 : 0.55}
              strokeWidth={selected ? 1.6 : 1}
            />
            <text x={callout.centre} y={T + callout.row * ROW_HEIGHT + 10} textAnchor="middle" className="fill-ink-900 text-[10.5px] font-semibold" paintOrder="stroke" stroke="#ffffff" strokeWidth={3}>
              {short}
            </text>
            <text x={callout.centre} y={T + callout.row * ROW_HEIGHT + 22} textAnchor="middle" fill={colour} className="text-[10.5px] font-semibold tabular" paintOrder="stroke" stroke="#ffffff" strokeWidth={3}>
              {STATUS_LABELS[lc.status]}: {crossing ? figure : `beside, ${figure}`} (req {formatNumber(lc.required, digits)})
            </text>
          </>
        )}
      </g>
    );
  };

  const points = bore.profile;
  const coverInfo = report?.cover ?? null;
  const boreSelected = sameItem(selection.selected, { type: 'bore', id: bore.id });

  return (
    <div ref={box} className="w-full min-w-0 overflow-hidden" id={props.id}>
      <svg
        ref={svgRef}
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        role="group"
        aria-label={`Profile of ${bore.name}: stations ${formatStation(begin, stationStyle)} to ${formatStation(end, stationStyle)}, elevations in ${u} ${datum}, vertical exaggeration ${scales.ve}×`}
        data-testid="profile-strip"
        data-exaggeration={scales.ve}
        className="block h-auto w-full touch-none select-none font-sans"
        onClick={() => store.select(null)}
      >
        <defs>
          <clipPath id={`clip-${bore.id}`}>
            <rect x={M.left} y={T} width={width - M.left - M.right} height={height - T - M.bottom} />
          </clipPath>
          <pattern id={`soil-${bore.id}`} width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="8" height="8" fill="#f3ede1" />
            <line x1="0" y1="0" x2="0" y2="8" stroke="#e2d6bf" strokeWidth="2" />
          </pattern>
        </defs>
        <rect x={0} y={0} width={width} height={height} fill="#ffffff" />
        {/* grid */}
        <g stroke="#eceef0" strokeWidth={1}>
          {xTicks.map((t) => (
            <line key={`gx${t}`} x1={x(t)} x2={x(t)} y1={scales.top} y2={height - M.bottom} />
          ))}
          {yTicks.map((t) => (
            <line key={`gy${t}`} x1={M.left} x2={width - M.right} y1={y(t)} y2={y(t)} />
          ))}
        </g>
        <g clipPath={`url(#clip-${bore.id})`}>
          <path d={groundFill} fill={`url(#soil-${bore.id})`} />
          {windowPath && <path d={windowPath} fill="#15803d" fillOpacity={0.1} stroke="#15803d" strokeOpacity={0.5} strokeDasharray="5 4" data-testid="bore-window" />}
          {pitBoxes.map(({ pit, s0, s1, top }) => (
            <g
              key={pit.id}
              role="button"
              tabIndex={-1}
              aria-label={`${pit.kind === 'launch' ? 'Launch' : 'Receiving'} pit, bottom ${formatNumber(pit.bottomElevation, digits)} ${u}`}
              onClick={(e) => {
                e.stopPropagation();
                select({ type: 'pit', id: pit.id });
              }}
            >
              <rect
                x={x(s0)}
                y={y(top)}
                width={Math.max(2, x(s1) - x(s0))}
                height={Math.max(0, y(pit.bottomElevation) - y(top))}
                fill="#ffffff"
                stroke={sameItem(selection.selected, { type: 'pit', id: pit.id }) ? '#0ea5e9' : '#6b7681'}
                strokeWidth={1.5}
                strokeDasharray="4 3"
              />
            </g>
          ))}
          <path d={groundPath} fill="none" stroke="#7a5c2e" strokeWidth={2} />
          {coverLine && <path d={coverLine} fill="none" stroke="#7a5c2e" strokeWidth={1} strokeDasharray="2 3" />}
          {/* tolerance envelope, casing band */}
          <path d={band(radius + bore.toleranceVertical, -radius - bore.toleranceVertical)} fill="#94a3b8" fillOpacity={0.18} stroke="#64748b" strokeDasharray="6 3" strokeWidth={1} data-testid="tolerance-envelope" />
          <path
            d={band(radius, -radius)}
            fill="#ffffff"
            stroke={boreSelected ? '#0ea5e9' : '#1e2226'}
            strokeWidth={boreSelected ? 3 : 1.6}
            className="cursor-pointer"
            onClick={(e) => {
              e.stopPropagation();
              select({ type: 'bore', id: bore.id });
            }}
          />
          <path d={path(points)} fill="none" stroke="#1e2226" strokeWidth={0.8} strokeDasharray="8 3 2 3" />
          {holeTicks.map(({ hole, station, ground }) => {
            const item: PlanItem = { type: 'hole', id: hole.id };
            const sel = sameItem(selection.selected, item) || sameItem(selection.hovered, item);
            return (
              <g
                key={hole.id}
                data-hole-id={hole.id}
                className="cursor-pointer"
                onClick={(e) => {
                  e.stopPropagation();
                  select(item);
                }}
                onMouseEnter={() => store.hover(item)}
                onMouseLeave={() => sameItem(store.get().hovered, item) && store.hover(null)}
              >
                <title>{`${hole.number} (${hole.status}) at ${formatStation(station, stationStyle)}`}</title>
                <line x1={x(station)} x2={x(station)} y1={y(ground) - 9} y2={y(ground) + 5} stroke={sel ? '#0ea5e9' : '#1e2226'} strokeWidth={sel ? 3 : 1.5} />
                {(labelledHoles.has(hole.id) || sel) && (
                  <text x={x(station)} y={y(ground) - 12} textAnchor="middle" className="fill-ink-700 text-[9.5px]" paintOrder="stroke" stroke="#ffffff" strokeWidth={2.5}>
                    {hole.number}
                  </text>
                )}
              </g>
            );
          })}
          {(report?.lines ?? []).map(drawLine)}
          {editing &&
            points.map((p, i) => (
              <circle
                key={i}
                cx={x(p.station)}
                cy={y(p.elevation)}
                r={7}
                fill="#0ea5e9"
                stroke="#ffffff"
                strokeWidth={2}
                tabIndex={0}
                role="slider"
                aria-label={`Profile point ${i + 1} at ${formatStation(p.station, stationStyle)}, elevation ${formatNumber(p.elevation, digits)} ${u} ${datum}`}
                aria-valuenow={p.elevation}
                aria-valuetext={`${formatNumber(p.elevation, digits)} ${u}`}
                className="cursor-ns-resize focus-visible:outline-none"
                data-profile-point={i}
                onPointerDown={onPointerDown(i)}
                onPointerMove={onPointerMove}
                onPointerUp={onPointerUp}
                onClick={(e) => e.stopPropagation()}
                onKeyDown={(e) => {
                  if (!onMovePoint) return;
                  const step = e.shiftKey ? 1 : 0.1;
                  if (e.key === 'ArrowUp' || e.key === 'ArrowDown') {
                    e.preventDefault();
                    onMovePoint(i, p.station, round(p.elevation + (e.key === 'ArrowUp' ? step : -step), 2));
                  } else if ((e.key === 'ArrowLeft' || e.key === 'ArrowRight') && i > 0 && i < points.length - 1) {
                    e.preventDefault();
                    const s = round(p.station + (e.key === 'ArrowRight' ? step * 10 : -step * 10), 2);
                    if (s > points[i - 1]!.station && s < points[i + 1]!.station) onMovePoint(i, s, p.elevation);
                  }
                }}
              />
            ))}
        </g>
        {/* axes */}
        <g className="fill-ink-700 text-[10.5px] tabular">
          <line x1={M.left} x2={width - M.right} y1={height - M.bottom} y2={height - M.bottom} stroke="#6b7681" />
          <line x1={M.left} x2={M.left} y1={scales.top} y2={height - M.bottom} stroke="#6b7681" />
          {xTicks.map((t) => (
            <g key={`x${t}`}>
              <line x1={x(t)} x2={x(t)} y1={height - M.bottom} y2={height - M.bottom + 4} stroke="#6b7681" />
              <text x={x(t)} y={height - M.bottom + 15} textAnchor="middle">
                {formatStation(t, stationStyle, t % 1 === 0 ? 0 : 2)}
              </text>
            </g>
          ))}
          {yTicks.map((t) => (
            <g key={`y${t}`}>
              <line x1={M.left - 4} x2={M.left} y1={y(t)} y2={y(t)} stroke="#6b7681" />
              <text x={M.left - 6} y={y(t) + 3.5} textAnchor="end">
                {formatNumber(t, yDecimals)}
              </text>
            </g>
          ))}
          <text x={(M.left + width - M.right) / 2} y={height - 6} textAnchor="middle" className="fill-ink-800 font-medium">
            Station ({stationStyle === '100' ? `100-${u} stations` : `1000-${u} stations`}) along {bore.name}
          </text>
          <text transform={`translate(13 ${(scales.top + height - M.bottom) / 2}) rotate(-90)`} textAnchor="middle" className="fill-ink-800 font-medium">
            Elevation, {u} ({datum})
          </text>
          <text x={width - M.right} y={narrow ? 12 : 14} textAnchor="end" className="fill-ink-800 font-medium" data-testid="vertical-exaggeration">
            Vertical exaggeration {scales.ve}×
          </text>
          {coverInfo && (
            <text x={narrow ? 6 : M.left + 4} y={narrow ? 26 : 14} className={coverInfo.belowMinimum ? 'fill-danger-700 font-semibold' : 'fill-ink-700'}>
              Least cover {formatNumber(coverInfo.minimum, digits)} {u} at {formatStation(coverInfo.station, stationStyle)} (minimum {formatNumber(bore.minCover, digits)} {u})
            </text>
          )}
        </g>
      </svg>
    </div>
  );
}
