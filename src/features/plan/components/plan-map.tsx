/**
 * The plan: Leaflet (through react-leaflet's container) over the project's own base-map tiles,
 * with lines in their APWA colours, bores with station ticks, pits, test holes, suggested holes
 * and crossing markers. Loaded lazily (this module and Leaflet form their own chunk).
 *
 * Performance: one canvas renderer for every vector layer; layers are built once per data
 * change in effects (never on each render) and keyed by id, so a selection or hover restyles
 * just the two layers involved; path styles are memoised objects.
 */
import 'leaflet/dist/leaflet.css';
import './plan-map.css';
import L from 'leaflet';
import iconRetinaUrl from 'leaflet/dist/images/marker-icon-2x.png';
import iconUrl from 'leaflet/dist/images/marker-icon.png';
import shadowUrl from 'leaflet/dist/images/marker-shadow.png';
import { useEffect, useMemo, useRef, useState, type RefObject } from 'react';
import { MapContainer } from 'react-leaflet';
import { LINE_KIND_COLOURS, type ClearanceStatus, type HoleStatus, type LineKind, type QualityLevel, type StationStyle } from '@shared/domain';
import type { BoreDto, HoleDto, LineDto, PitDto, TilesetDto } from '@shared/api';
import { formatStation, geodesicLength, pointAtStationSignedOffset, stationOffset, type BoreReport } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { formatNumber } from '@/lib/format';
import { tileUrlTemplate } from '../api/get-tileset';
import { gridBox, niceLength, type ProjectFrame, type XY } from '../lib/geo';
import { sameItem, useSelectionStore, type PlanItem, type SelectionStore } from '../lib/selection';
import { BORE_STYLE, HOLE_STYLES, QL_DASH, STATUS_COLOURS, STATUS_LABELS, SUGGESTED_STYLE } from '../lib/styles';

// Leaflet's default marker images, resolved by Vite (STACK.md §4); no default marker is used
// today, but a stray one must not 404.
delete (L.Icon.Default.prototype as unknown as { _getIconUrl?: unknown })._getIconUrl;
L.Icon.Default.mergeOptions({ iconUrl, iconRetinaUrl, shadowUrl });

/** Which overlays are shown (the legend's toggles). */
export interface LayerState {
  basemap: boolean;
  lines: boolean;
  holes: boolean;
  suggested: boolean;
  conflicts: boolean;
  bores: boolean;
  stations: boolean;
}

export interface PlanMapProps {
  projectId: number;
  frame: ProjectFrame;
  stationStyle: StationStyle;
  lines: readonly LineDto[];
  /** Bores as saved: editing a profile never moves anything in plan. */
  bores: readonly BoreDto[];
  pits: readonly PitDto[];
  holes: readonly HoleDto[];
  /** Live bore reports (crossing markers and suggested holes follow the edit). */
  reports: readonly BoreReport[];
  activeBoreId: number | null;
  tileset: TilesetDto | null;
  layers: LayerState;
  className?: string;
}

type LineState = 'normal' | 'hover' | 'selected';

// ---------------------------------------------------------------------------------------------
// Memoised path styles

const lineStyles = new Map<string, L.PathOptions>();
function lineStyle(kind: LineKind, ql: QualityLevel, abandoned: boolean, state: LineState): L.PathOptions {
  const key = `${kind}|${ql}|${abandoned}|${state}`;
  let s = lineStyles.get(key);
  if (!s) {
    const weight = state === 'selected' ? 7 : state === 'hover' ? 5 : 3;
    s = {
      color: LINE_KIND_COLOURS[kind],
      weight,
      opacity: abandoned && state === 'normal' ? 0.45 : 1,
      dashArray: QL_DASH[ql] ?? undefined,
      lineCap: QL_DASH[ql] ? 'butt' : 'round',
      className: 'tl-line',
    };
    lineStyles.set(key, s);
  }
  return s;
}

const holeStyles = new Map<string, L.CircleMarkerOptions>();
function holeStyle(status: HoleStatus, state: LineState): L.CircleMarkerOptions {
  const key = `${status}|${state}`;
  let s = holeStyles.get(key);
  if (!s) {
    const h = HOLE_STYLES[status];
    s = {
      radius: state === 'selected' ? 9 : state === 'hover' ? 7.5 : 6,
      color: state === 'normal' ? h.stroke : '#0ea5e9',
      weight: state === 'normal' ? 1.5 : 3,
      fillColor: h.fill,
      fillOpacity: 1,
      dashArray: h.dash ?? undefined,
    };
    holeStyles.set(key, s);
  }
  return s;
}

const BORE_OUTLINE: L.PolylineOptions = { color: BORE_STYLE.outline, weight: 9, opacity: 1, lineCap: 'butt' };
const BORE_OUTLINE_SELECTED: L.PolylineOptions = { color: '#0ea5e9', weight: 13, opacity: 1, lineCap: 'butt' };
const BORE_FILL: L.PolylineOptions = { color: BORE_STYLE.fill, weight: 4, opacity: 1, lineCap: 'butt', interactive: false };
const TICKS: L.PolylineOptions = { color: BORE_STYLE.outline, weight: 1.5, opacity: 1, interactive: false };
const PIT: L.PolylineOptions = { color: '#1e2226', weight: 1.5, fillColor: '#6b7681', fillOpacity: 0.35, dashArray: '4 3' };
const PIT_SELECTED: L.PolylineOptions = { ...PIT, color: '#0ea5e9', weight: 3 };

function markerStyle(status: ClearanceStatus): L.CircleMarkerOptions {
  return { radius: 9, color: STATUS_COLOURS[status], weight: 3, fillColor: '#ffffff', fillOpacity: 0.6 };
}
const SUGGESTED: L.CircleMarkerOptions = { radius: 8, color: SUGGESTED_STYLE.stroke, weight: 2, dashArray: SUGGESTED_STYLE.dash, fill: false };

// ---------------------------------------------------------------------------------------------

/** Station tick spacing and label spacing for a station style. */
function tickSpacing(style: StationStyle): { tick: number; label: number; half: number } {
  return style === '100' ? { tick: 50, label: 100, half: 4 } : { tick: 10, label: 50, half: 1.5 };
}

function toLatLngs(frame: ProjectFrame, points: readonly XY[]): L.LatLngExpression[] {
  return points.map((p) => frame.toLatLng(p));
}

/** Above this many items a layer keeps on the map only what is near the view (the rest is added back as the map moves). */
const CULL_ABOVE = 1500;

/**
 * Keep in `group` only the items whose bounds meet the view (padded by half a screen), updated
 * after each move or zoom; small layers are simply all added.
 */
function cullInto(map: L.Map, group: L.LayerGroup, items: { layer: L.Layer; box: L.LatLngBounds }[]): () => void {
  if (items.length <= CULL_ABOVE) {
    for (const it of items) group.addLayer(it.layer);
    return () => undefined;
  }
  const update = () => {
    const view = map.getBounds().pad(0.5);
    for (const it of items) {
      const inside = view.intersects(it.box);
      const on = group.hasLayer(it.layer);
      if (inside && !on) group.addLayer(it.layer);
      else if (!inside && on) group.removeLayer(it.layer);
    }
  };
  update();
  map.on('moveend', update);
  return () => map.off('moveend', update);
}

/** A tooltip made on first hover (thousands of layers need no tooltip objects up front). */
function lazyTooltip(layer: L.Path, text: () => string, options: L.TooltipOptions = {}): void {
  layer.once('mouseover', () => {
    layer.bindTooltip(text(), { className: 'tl-map-tip', ...options }).openTooltip();
  });
}

function initialBounds(frame: ProjectFrame, props: Pick<PlanMapProps, 'bores' | 'lines' | 'activeBoreId' | 'tileset' | 'reports'>): L.LatLngBounds {
  const active = props.bores.find((b) => b.id === props.activeBoreId);
  let box: [number, number, number, number] | null = null;
  if (active) {
    const report = props.reports.find((r) => r.boreId === active.id);
    const near = new Set(report?.lines.map((l) => l.lineId) ?? []);
    const pts: XY[] = [...active.alignment];
    for (const l of props.lines) if (near.has(l.id)) for (const p of l.path) pts.push(p);
    box = gridBox(pts);
    // the near lines may run far along the road: keep the bore in the middle, at most 1.8× its extent
    const boreBox = gridBox(active.alignment)!;
    const span = Math.max(boreBox[2] - boreBox[0], boreBox[3] - boreBox[1], 1);
    if (box) {
      const cx = (boreBox[0] + boreBox[2]) / 2;
      const cy = (boreBox[1] + boreBox[3]) / 2;
      box = [Math.max(box[0], cx - 0.9 * span), Math.max(box[1], cy - 0.9 * span), Math.min(box[2], cx + 0.9 * span), Math.min(box[3], cy + 0.9 * span)];
    }
  }
  if (!box) box = gridBox(props.lines.flatMap((l) => l.path));
  if (box) {
    const pad = Math.max(box[2] - box[0], box[3] - box[1]) * 0.08 + 1;
    const corners = [
      frame.toLatLng([box[0] - pad, box[1] - pad]),
      frame.toLatLng([box[2] + pad, box[3] + pad]),
      frame.toLatLng([box[0] - pad, box[3] + pad]),
      frame.toLatLng([box[2] + pad, box[1] - pad]),
    ];
    return L.latLngBounds(corners);
  }
  if (props.tileset?.bounds) {
    const [w, s, e, n] = props.tileset.bounds;
    return L.latLngBounds([s, w], [n, e]);
  }
  return L.latLngBounds([-60, -170], [75, 170]);
}

/** A background of the project's grid: lines at round easting and northing values. */
function gridBackground(frame: ProjectFrame, map: L.Map): L.GridLayer {
  const GridBackground = L.GridLayer.extend({
    createTile(coords: L.Coords) {
      const size = 256;
      const tile = document.createElement('canvas');
      tile.width = size;
      tile.height = size;
      const ctx = tile.getContext('2d');
      if (!ctx) return tile;
      ctx.fillStyle = '#f5f6f7';
      ctx.fillRect(0, 0, size, size);
      const origin = L.point(coords.x * size, coords.y * size);
      const toGrid = (x: number, y: number) => {
        const ll = map.unproject(origin.add([x, y]), coords.z);
        return frame.toGrid(ll.lat, ll.lng);
      };
      const toPx = (e: number, n: number) => {
        const [lat, lng] = frame.toLatLng([e, n]);
        const p = map.project(L.latLng(lat, lng), coords.z);
        return [p.x - origin.x, p.y - origin.y] as const;
      };
      let corners: [number, number][];
      try {
        corners = [toGrid(0, 0), toGrid(size, 0), toGrid(0, size), toGrid(size, size)];
      } catch {
        return tile;
      }
      const es = corners.map((c) => c[0]);
      const ns = corners.map((c) => c[1]);
      const e0 = Math.min(...es);
      const e1 = Math.max(...es);
      const n0 = Math.min(...ns);
      const n1 = Math.max(...ns);
      const step = niceLength((e1 - e0) / 2);
      if (!(step > 0) || !Number.isFinite(step)) return tile;
      ctx.strokeStyle = '#dde1e5';
      ctx.lineWidth = 1;
      ctx.beginPath();
      for (let e = Math.ceil(e0 / step) * step; e <= e1; e += step) {
        const a = toPx(e, n0);
        const b = toPx(e, n1);
        ctx.moveTo(a[0], a[1]);
        ctx.lineTo(b[0], b[1]);
      }
      for (let n = Math.ceil(n0 / step) * step; n <= n1; n += step) {
        const a = toPx(e0, n);
        const b = toPx(e1, n);
        ctx.moveTo(a[0], a[1]);
        ctx.lineTo(b[0], b[1]);
      }
      ctx.stroke();
      return tile;
    },
  });
  return new (GridBackground as unknown as new (o: L.GridLayerOptions) => L.GridLayer)({ zIndex: 0, maxZoom: 24 });
}

// ---------------------------------------------------------------------------------------------

export default function PlanMap(props: PlanMapProps) {
  const [map, setMap] = useState<L.Map | null>(null);
  const wrapper = useRef<HTMLDivElement>(null);
  const [measuring, setMeasuring] = useState(false);
  const measuringRef = useRef(false);
  measuringRef.current = measuring;
  // Fit once, when the map is made; later data changes never move the view under the user.
  const [bounds] = useState(() => initialBounds(props.frame, props));
  const renderer = useMemo(() => L.canvas({ tolerance: 7, padding: 0.3 }), []);
  // The printed sheet lays the map out at another size: let Leaflet measure again.
  useEffect(() => {
    if (!map) return;
    const fit = () => map.invalidateSize();
    const media = window.matchMedia('print');
    window.addEventListener('beforeprint', fit);
    window.addEventListener('afterprint', fit);
    media.addEventListener('change', fit);
    return () => {
      window.removeEventListener('beforeprint', fit);
      window.removeEventListener('afterprint', fit);
      media.removeEventListener('change', fit);
    };
  }, [map]);

  return (
    <div ref={wrapper} className={props.className} data-testid="plan-map" data-line-count={0}>
      <MapContainer
        ref={setMap}
        bounds={bounds}
        boundsOptions={{ padding: [8, 8] }}
        preferCanvas
        renderer={renderer}
        maxZoom={23}
        zoomSnap={0.25}
        zoomDelta={0.5}
        wheelPxPerZoomLevel={90}
        className="size-full"
        attributionControl
      />
      {map && (
        <>
          <MapLayers map={map} wrapper={wrapper} measuringRef={measuringRef} {...props} />
          <MapReadouts map={map} {...props} measuring={measuring} setMeasuring={setMeasuring} />
        </>
      )}
    </div>
  );
}

function MapLayers({ map, wrapper, measuringRef, ...props }: PlanMapProps & { map: L.Map; wrapper: RefObject<HTMLDivElement | null>; measuringRef: RefObject<boolean> }) {
  const store = useSelectionStore();
  const { frame, lines, bores, pits, holes, reports, activeBoreId, tileset, layers, projectId, stationStyle } = props;
  const lineLayers = useRef(new Map<number, { layer: L.Polyline; line: LineDto }>());
  const holeLayers = useRef(new Map<number, { layer: L.CircleMarker; hole: HoleDto }>());
  const boreLayers = useRef(new Map<number, L.Polyline>());
  const pitLayers = useRef(new Map<number, L.Polygon>());
  const [version, setVersion] = useState(0);

  // Base: the project's grid, with the tile set over it where there is one.
  useEffect(() => {
    const grid = gridBackground(frame, map).addTo(map);
    let tiles: L.TileLayer | null = null;
    if (tileset?.available && tileset.bounds && layers.basemap) {
      const [w, s, e, n] = tileset.bounds;
      tiles = L.tileLayer(tileUrlTemplate(projectId, tileset.version), {
        bounds: L.latLngBounds([s, w], [n, e]),
        minNativeZoom: tileset.minZoom ?? 0,
        maxNativeZoom: tileset.maxZoom ?? 19,
        maxZoom: 23,
        zIndex: 1,
        attribution: tileset.attribution ?? 'Base map served by Threadline',
      });
      tiles.on('load', () => wrapper.current?.setAttribute('data-tiles-loaded', 'true'));
      tiles.addTo(map);
    } else {
      wrapper.current?.setAttribute('data-tiles-loaded', 'none');
    }
    return () => {
      grid.remove();
      tiles?.remove();
    };
  }, [map, frame, tileset, layers.basemap, projectId, wrapper]);

  // Select on click (unless measuring: then the click belongs to the measuring tool), hover on pointer.
  const bind = (layer: L.Path, item: PlanItem) => {
    layer.on('click', (e) => {
      if (measuringRef.current) return;
      L.DomEvent.stopPropagation(e);
      store.select(item);
    });
    layer.on('mouseover', () => store.hover(item));
    layer.on('mouseout', () => {
      if (sameItem(store.get().hovered, item)) store.hover(null);
    });
  };

  // Lines, built once per data change.
  useEffect(() => {
    const group = L.layerGroup();
    const byId = new Map<number, { layer: L.Polyline; line: LineDto }>();
    const items: { layer: L.Layer; box: L.LatLngBounds }[] = [];
    for (const line of lines) {
      const layer = L.polyline(toLatLngs(frame, line.path), lineStyle(line.kind, line.qualityLevel, line.status === 'abandoned', 'normal'));
      lazyTooltip(layer, () => line.label, { sticky: true });
      bind(layer, { type: 'line', id: line.id });
      items.push({ layer, box: layer.getBounds() });
      byId.set(line.id, { layer, line });
    }
    lineLayers.current = byId;
    let stop = () => undefined as void;
    if (layers.lines) {
      group.addTo(map);
      stop = cullInto(map, group, items);
    }
    // how many lines the map holds (drawn where they meet the view)
    wrapper.current?.setAttribute('data-line-count', String(layers.lines ? byId.size : 0));
    setVersion((v) => v + 1);
    return () => {
      stop();
      group.remove();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, frame, lines, layers.lines]);

  // Bores (white on a dark casing outline), station ticks, labels on the active bore, pits.
  useEffect(() => {
    if (!layers.bores) return;
    const group = L.layerGroup();
    const boreById = new Map<number, L.Polyline>();
    const pitById = new Map<number, L.Polygon>();
    const { tick, label, half } = tickSpacing(stationStyle);
    for (const bore of bores) {
      const latlngs = toLatLngs(frame, bore.alignment);
      const outline = L.polyline(latlngs, BORE_OUTLINE);
      outline.bindTooltip(bore.name, { sticky: true, className: 'tl-map-tip' });
      bind(outline, { type: 'bore', id: bore.id });
      group.addLayer(outline);
      group.addLayer(L.polyline(latlngs, BORE_FILL));
      boreById.set(bore.id, outline);
      let length = 0;
      for (let i = 1; i < bore.alignment.length; i++) length += Math.hypot(bore.alignment[i]![0] - bore.alignment[i - 1]![0], bore.alignment[i]![1] - bore.alignment[i - 1]![1]);
      const end = bore.beginStation + length;
      const ticks: L.LatLngExpression[][] = [];
      const stations = new Set<number>([bore.beginStation, end]);
      for (let s = Math.ceil(bore.beginStation / tick) * tick; s <= end + 1e-9; s += tick) stations.add(s);
      for (const s of stations) {
        const big = Math.abs(s / label - Math.round(s / label)) < 1e-9 || s === bore.beginStation || s === end;
        const a = pointAtStationSignedOffset(bore.alignment, bore.beginStation, s, -half * (big ? 1.6 : 1));
        const b = pointAtStationSignedOffset(bore.alignment, bore.beginStation, s, half * (big ? 1.6 : 1));
        ticks.push([frame.toLatLng([a.easting, a.northing]), frame.toLatLng([b.easting, b.northing])]);
        if (layers.stations && bore.id === activeBoreId && big) {
          const at = pointAtStationSignedOffset(bore.alignment, bore.beginStation, s, half * 2.2);
          group.addLayer(
            L.tooltip({ permanent: true, direction: 'right', className: 'tl-station-label', offset: [2, 0], interactive: false })
              .setLatLng(frame.toLatLng([at.easting, at.northing]))
              .setContent(formatStation(s, stationStyle, 0)),
          );
        }
      }
      group.addLayer(L.polyline(ticks, TICKS));
    }
    for (const pit of pits) {
      const layer = L.polygon(toLatLngs(frame, pit.footprint), PIT);
      layer.bindTooltip(`${pit.kind === 'launch' ? 'Launch' : 'Receiving'} pit`, { sticky: true, className: 'tl-map-tip' });
      bind(layer, { type: 'pit', id: pit.id });
      group.addLayer(layer);
      pitById.set(pit.id, layer);
    }
    boreLayers.current = boreById;
    pitLayers.current = pitById;
    group.addTo(map);
    setVersion((v) => v + 1);
    return () => {
      group.remove();
      boreLayers.current = new Map();
      pitLayers.current = new Map();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, frame, bores, pits, activeBoreId, stationStyle, layers.bores, layers.stations]);

  // Crossing markers and suggested holes follow the live report.
  useEffect(() => {
    const group = L.layerGroup();
    const labels = new Map(lines.map((l) => [l.id, l.label]));
    for (const report of reports) {
      if (layers.conflicts) {
        for (const lc of report.lines) {
          if (lc.status !== 'overlap' && lc.status !== 'conflict' && lc.status !== 'marginal') continue;
          const p = lc.points[lc.governingPoint];
          if (!p) continue;
          const marker = L.circleMarker(frame.toLatLng([p.easting, p.northing]), markerStyle(lc.status));
          lazyTooltip(marker, () => `${STATUS_LABELS[lc.status]}: ${lc.label}`);
          bind(marker, { type: 'line', id: lc.lineId });
          group.addLayer(marker);
        }
      }
      if (layers.suggested) {
        for (const s of report.suggestedHoles) {
          const marker = L.circleMarker(frame.toLatLng([s.easting, s.northing]), SUGGESTED);
          const label = labels.get(s.lineId) ?? `line ${s.lineId}`;
          lazyTooltip(marker, () => `Suggested test hole: ${label}, ${formatStation(s.station, stationStyle)}`);
          bind(marker, { type: 'line', id: s.lineId });
          group.addLayer(marker);
        }
      }
    }
    group.addTo(map);
    return () => {
      group.remove();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, frame, reports, lines, stationStyle, layers.conflicts, layers.suggested]);

  // Test holes on top.
  useEffect(() => {
    if (!layers.holes) {
      holeLayers.current = new Map();
      return;
    }
    const group = L.layerGroup();
    const byId = new Map<number, { layer: L.CircleMarker; hole: HoleDto }>();
    const items: { layer: L.Layer; box: L.LatLngBounds }[] = [];
    for (const hole of holes) {
      const e = hole.surveyedEasting ?? hole.easting;
      const n = hole.surveyedNorthing ?? hole.northing;
      const ll = frame.toLatLng([e, n]);
      const layer = L.circleMarker(ll, holeStyle(hole.status, 'normal'));
      lazyTooltip(layer, () => `${hole.number} (${hole.status})`);
      bind(layer, { type: 'hole', id: hole.id });
      items.push({ layer, box: L.latLngBounds([ll, ll]) });
      byId.set(hole.id, { layer, hole });
    }
    holeLayers.current = byId;
    group.addTo(map);
    const stop = cullInto(map, group, items);
    setVersion((v) => v + 1);
    return () => {
      stop();
      group.remove();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, frame, holes, layers.holes]);

  // Selection and hover: restyle only what changed; say on the element what the map shows as selected.
  useEffect(() => {
    let shown: { selected: PlanItem | null; hovered: PlanItem | null } = { selected: null, hovered: null };
    const stateOf = (item: PlanItem, s: typeof shown): LineState =>
      sameItem(item, s.selected) ? 'selected' : sameItem(item, s.hovered) ? 'hover' : 'normal';
    const restyle = (item: PlanItem | null, s: typeof shown) => {
      if (!item) return;
      const state = stateOf(item, s);
      if (item.type === 'line') {
        const entry = lineLayers.current.get(item.id);
        if (!entry) return;
        entry.layer.setStyle(lineStyle(entry.line.kind, entry.line.qualityLevel, entry.line.status === 'abandoned', state));
        if (state !== 'normal' && map.hasLayer(entry.layer)) entry.layer.bringToFront();
      } else if (item.type === 'hole') {
        const entry = holeLayers.current.get(item.id);
        if (!entry) return;
        entry.layer.setStyle(holeStyle(entry.hole.status, state));
        if (state !== 'normal' && map.hasLayer(entry.layer)) entry.layer.bringToFront();
      } else if (item.type === 'bore') {
        boreLayers.current.get(item.id)?.setStyle(state === 'normal' ? BORE_OUTLINE : BORE_OUTLINE_SELECTED);
      } else if (item.type === 'pit') {
        pitLayers.current.get(item.id)?.setStyle(state === 'normal' ? PIT : PIT_SELECTED);
      }
    };
    const layerOf = (item: PlanItem): L.Path | undefined =>
      item.type === 'line' ? lineLayers.current.get(item.id)?.layer
        : item.type === 'hole' ? holeLayers.current.get(item.id)?.layer
          : item.type === 'bore' ? boreLayers.current.get(item.id)
            : pitLayers.current.get(item.id);
    const apply = () => {
      const next = store.get();
      const before = shown;
      shown = { selected: next.selected, hovered: next.hovered };
      for (const item of [before.selected, before.hovered, next.selected, next.hovered]) restyle(item, shown);
      const el = wrapper.current;
      const sel = next.selected;
      const drawn = sel ? layerOf(sel) : undefined;
      if (el) {
        el.dataset.selectedType = sel && drawn ? sel.type : '';
        el.dataset.selectedId = sel && drawn ? String(sel.id) : '';
      }
      // Something chosen in the strip or the table that is off screen: bring it into view.
      if (sel && drawn && !sameItem(before.selected, sel)) {
        const b = 'getBounds' in drawn ? (drawn as L.Polyline).getBounds() : L.latLngBounds([(drawn as L.CircleMarker).getLatLng()]);
        if (!map.getBounds().intersects(b)) map.fitBounds(b, { maxZoom: Math.max(map.getZoom(), 17), padding: [30, 30] });
      }
    };
    apply();
    return store.subscribe(apply);
  }, [store, map, wrapper, version]);

  return null;
}

// ---------------------------------------------------------------------------------------------
// Readouts over the map: scale bar, north arrow, cursor position, measuring tool.

function MapReadouts(props: PlanMapProps & { map: L.Map; measuring: boolean; setMeasuring: (on: boolean) => void }) {
  const { map, frame, bores, activeBoreId, stationStyle, measuring, setMeasuring } = props;
  const unit = UNIT_SYMBOLS[frame.unit];
  const [scale, setScale] = useState<{ px: number; length: number } | null>(null);
  const [convergence, setConvergence] = useState<number | null>(null);
  const [cursor, setCursor] = useState<[number, number] | null>(null);
  const [points, setPoints] = useState<[number, number][]>([]);
  const active = bores.find((b) => b.id === activeBoreId) ?? null;

  useEffect(() => {
    const update = () => {
      const size = map.getSize();
      const y = size.y / 2;
      const x0 = size.x / 2 - 50;
      try {
        const a = map.containerPointToLatLng([x0, y]);
        const b = map.containerPointToLatLng([x0 + 100, y]);
        const ga = frame.toGrid(a.lat, a.lng);
        const gb = frame.toGrid(b.lat, b.lng);
        const perPx = Math.hypot(gb[0] - ga[0], gb[1] - ga[1]) / 100;
        const length = niceLength(perPx * 110);
        setScale({ px: length / perPx, length });
        // grid north against true north at the centre
        const c = map.getCenter();
        const g = frame.toGrid(c.lat, c.lng);
        const up = frame.toLatLng([g[0], g[1] + 100]);
        const p0 = map.latLngToContainerPoint(c);
        const p1 = map.latLngToContainerPoint(L.latLng(up[0], up[1]));
        setConvergence((Math.atan2(p1.x - p0.x, p0.y - p1.y) * 180) / Math.PI);
      } catch {
        setScale(null);
      }
    };
    update();
    map.on('zoomend moveend resize', update);
    return () => {
      map.off('zoomend moveend resize', update);
    };
  }, [map, frame]);

  useEffect(() => {
    let frameId = 0;
    const move = (e: L.LeafletMouseEvent) => {
      cancelAnimationFrame(frameId);
      frameId = requestAnimationFrame(() => {
        try {
          setCursor(frame.toGrid(e.latlng.lat, e.latlng.lng));
        } catch {
          setCursor(null);
        }
      });
    };
    const out = () => setCursor(null);
    map.on('mousemove', move);
    map.on('mouseout', out);
    return () => {
      cancelAnimationFrame(frameId);
      map.off('mousemove', move);
      map.off('mouseout', out);
    };
  }, [map, frame]);

  // Measuring: each map click adds a point; a dashed line joins them.
  useEffect(() => {
    const container = map.getContainer();
    container.classList.toggle('tl-measuring', measuring);
    if (!measuring) return;
    const click = (e: L.LeafletMouseEvent) => setPoints((ps) => [...ps, frame.toGrid(e.latlng.lat, e.latlng.lng)]);
    map.on('click', click);
    return () => {
      map.off('click', click);
      container.classList.remove('tl-measuring');
    };
  }, [map, frame, measuring]);

  useEffect(() => {
    if (points.length === 0) return;
    const group = L.layerGroup();
    const latlngs = points.map((p) => frame.toLatLng(p));
    group.addLayer(L.polyline(latlngs, { color: '#111827', weight: 2.5, dashArray: '6 4', interactive: false }));
    for (const ll of latlngs) group.addLayer(L.circleMarker(ll, { radius: 4, color: '#111827', weight: 2, fillColor: '#ffffff', fillOpacity: 1, interactive: false }));
    group.addTo(map);
    return () => {
      group.remove();
    };
  }, [map, frame, points]);

  const measurement = useMemo(() => {
    if (points.length === 0) return null;
    let grid = 0;
    for (let i = 1; i < points.length; i++) grid += Math.hypot(points[i]![0] - points[i - 1]![0], points[i]![1] - points[i - 1]![1]);
    const lonLat = points.map((p) => {
      const [lat, lng] = frame.toLatLng(p);
      return [lng, lat] as const;
    });
    const ellipsoid = points.length > 1 ? geodesicLength(lonLat) : 0;
    const last = points[points.length - 1]!;
    const so = active ? stationOffset(active.alignment, active.beginStation, last) : null;
    return { grid, ellipsoid, last, so };
  }, [points, frame, active]);

  const digits = frame.unit === 'm' ? 3 : 2;
  const metresPerUnit = frame.unit === 'm' ? 1 : frame.unit === 'ft' ? 0.3048 : 1200 / 3937;

  return (
    <>
      <div className="pointer-events-none absolute right-2 bottom-6 z-[1000] flex flex-col items-end gap-1">
        {scale && (
          <div className="rounded bg-white/90 px-2 py-1 text-[11px] font-medium text-ink-800 shadow-sm" data-testid="map-scale" aria-label={`Scale bar: ${formatNumber(scale.length, 0)} ${unit}`}>
            <div className="h-1.5 border-x-2 border-b-2 border-ink-800" style={{ width: `${Math.round(scale.px)}px` }} />
            <div className="mt-0.5 text-center tabular">{formatNumber(scale.length, scale.length < 1 ? 2 : 0)} {unit} (grid)</div>
          </div>
        )}
      </div>
      <div className="pointer-events-none absolute top-2 right-2 z-[1000] flex flex-col items-center rounded bg-white/90 px-1.5 py-1 text-ink-800 shadow-sm" aria-label="North arrow: up is true north">
        <svg aria-hidden viewBox="0 0 20 28" className="h-7 w-5">
          <path d="M10 1 17 24 10 19 3 24Z" fill="#1e2226" />
          <path d="M10 1 10 19 3 24Z" fill="#ffffff" stroke="#1e2226" strokeWidth="0.8" />
        </svg>
        <span className="text-[11px] leading-none font-bold">N</span>
        {convergence !== null && Math.abs(convergence) >= 0.05 && (
          <span className="mt-0.5 text-[10px] leading-tight text-ink-600" title="Convergence: the angle between grid north and true north here">
            grid {Math.abs(convergence).toFixed(1)}° {convergence > 0 ? 'E' : 'W'}
          </span>
        )}
      </div>
      <div className="absolute top-2 left-12 z-[1000] flex flex-wrap items-start gap-2 print:hidden">
        <button
          type="button"
          className={`min-h-9 rounded border px-2.5 text-xs font-medium shadow-sm ${measuring ? 'border-ink-900 bg-ink-900 text-white' : 'border-ink-300 bg-white text-ink-800 hover:bg-ink-100'}`}
          aria-pressed={measuring}
          onClick={() => {
            if (!measuring) setPoints([]);
            setMeasuring(!measuring);
          }}
        >
          {measuring ? 'Finish measuring' : 'Measure'}
        </button>
        {measurement && (
          <div className="rounded border border-ink-200 bg-white/95 px-2.5 py-1.5 text-xs text-ink-800 shadow-sm" data-testid="measure-readout" aria-live="polite">
            <p className="tabular">
              Grid distance: <strong>{formatNumber(measurement.grid, digits)} {unit}</strong>
            </p>
            {points.length > 1 && (
              <p className="tabular text-ink-600">
                On the ellipsoid (WGS 84): {formatNumber(measurement.ellipsoid / metresPerUnit, digits)} {unit}
                {frame.unit !== 'm' && ` = ${formatNumber(measurement.ellipsoid, 3)} m`}
              </p>
            )}
            {measurement.so && active && (
              <p className="tabular">
                Last point on {active.name}: {formatStation(measurement.so.station, stationStyle)}, {formatNumber(measurement.so.offset, digits)} {unit} {measurement.so.side}
                {measurement.so.beyond && ` (past the ${measurement.so.beyond})`}
              </p>
            )}
            <button type="button" className="mt-1 text-xs font-medium text-brand-700 underline" onClick={() => setPoints([])}>
              Clear measurement
            </button>
          </div>
        )}
      </div>
      <div className={`pointer-events-none absolute bottom-0 left-0 z-[1000] rounded-tr bg-white/85 px-2 py-0.5 text-[11px] text-ink-700 tabular ${cursor ? '' : 'hidden sm:block'}`} data-testid="map-cursor">
        {cursor ? (
          <>
            E {formatNumber(cursor[0], digits)} · N {formatNumber(cursor[1], digits)} {unit}
            {active && (() => {
              try {
                const so = stationOffset(active.alignment, active.beginStation, cursor);
                return ` · ${formatStation(so.station, stationStyle)} ${formatNumber(so.offset, digits === 3 ? 2 : 1)} ${so.side}`;
              } catch {
                return '';
              }
            })()}
          </>
        ) : (
          <>Point at the map for grid E/N ({frame.crs.code}, {unit})</>
        )}
      </div>
    </>
  );
}
